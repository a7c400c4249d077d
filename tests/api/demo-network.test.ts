import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { migrateToLatest, openDatabase, seedNetwork, type Db, type NetworkCounts } from '@busbar/db';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { generateNetwork } from '../../db/demo/network-shops.ts';
import { seededRandom } from '../../db/demo/random.ts';

const now = new Date('2026-06-15T15:00:00Z');
const dir = mkdtempSync(join(tmpdir(), 'busbar-network-'));
let db: Db;
let counts: NetworkCounts;

beforeAll(async () => {
  const file = join(dir, 'busbar.sqlite');
  counts = await seedNetwork({ file, locations: 3, years: 1, now, passwordHash: 'scrypt$10$8$1$x$y' });
  db = openDatabase(file);
}, 60_000);
afterAll(async () => {
  await db.destroy();
  rmSync(dir, { recursive: true, force: true });
});

const count = async (table: string) => Number((await sql<{ n: number }>`select count(*) as n from ${sql.table(table)}`.execute(db)).rows[0]!.n);

describe('generated network, 3 locations × 1 year', () => {
  it('has the three shops, each with a lead, technicians and a clerk, and about 1,000 builds a year each', async () => {
    const shops = await db
      .selectFrom('locations as l')
      .select(['l.code', 'l.timeZone'])
      .select((eb) => [
        eb.selectFrom('builds as b').whereRef('b.locationId', '=', 'l.id').select((e) => e.fn.countAll<number>().as('n')).as('builds'),
        eb.selectFrom('roleAssignments as r').whereRef('r.locationId', '=', 'l.id').where('r.role', '=', 'location_lead').select((e) => e.fn.countAll<number>().as('n')).as('leads'),
        eb.selectFrom('roleAssignments as r').whereRef('r.locationId', '=', 'l.id').where('r.role', '=', 'technician').select((e) => e.fn.countAll<number>().as('n')).as('technicians'),
        eb.selectFrom('roleAssignments as r').whereRef('r.locationId', '=', 'l.id').where('r.role', '=', 'warranty_clerk').select((e) => e.fn.countAll<number>().as('n')).as('clerks'),
      ])
      .orderBy('l.id')
      .execute();
    expect(shops.map((s) => s.code)).toEqual(['DEN', 'BOI', 'PDX']);
    for (const shop of shops) {
      expect(shop.builds).toBeGreaterThan(500);
      expect(shop.builds).toBeLessThan(2000);
      expect([shop.leads, shop.clerks]).toEqual([1, 1]);
      expect(shop.technicians).toBeGreaterThanOrEqual(2);
    }
    // Denver stays the busiest of the three, as in the demo.
    expect(Math.max(...shops.map((s) => Number(s.builds)))).toBe(Number(shops[0]!.builds));
    expect(counts.builds).toBe(shops.reduce((sum, s) => sum + Number(s.builds), 0));
    expect(counts.builds).toBe(await count('builds'));
    expect(counts.buildItems).toBe(await count('build_items'));
    expect(counts.auditLog).toBe(await count('audit_log'));
    expect(counts.buildItems / counts.builds).toBeGreaterThan(7);
  });

  it('reaches back one year and not past the clock', async () => {
    const range = await db.selectFrom('builds').select((eb) => [eb.fn.min('createdAt').as('first'), eb.fn.max('createdAt').as('last')]).executeTakeFirstOrThrow();
    const yearAgo = now.getTime() - 365.25 * 86_400_000;
    expect(Date.parse(range.first!)).toBeGreaterThanOrEqual(yearAgo - 2 * 86_400_000);
    expect(Date.parse(range.first!)).toBeLessThan(yearAgo + 14 * 86_400_000);
    expect(Date.parse(range.last!)).toBeLessThanOrEqual(now.getTime());
    expect(Date.parse(range.last!)).toBeGreaterThan(now.getTime() - 3 * 86_400_000);
    const late = await db.selectFrom('buildEvents').select('id').where('at', '>', now.toISOString()).execute();
    expect(late).toEqual([]);
  });

  it('numbers builds per shop without gaps and never repeats a serial number of a SKU', async () => {
    const numbering = await sql<{ code: string; n: number; top: number; numbers: number }>`
      select l.code, count(*) as n, max(b.sequence) as top, count(distinct b.number) as numbers
      from builds b join locations l on l.id = b.location_id group by l.code`.execute(db);
    for (const row of numbering.rows) expect([row.top, row.numbers]).toEqual([row.n, row.n]);
    const serials = await sql<{ n: number; distinct: number }>`
      select count(*) as n, count(distinct sku || ' ' || serial_number) as "distinct" from build_items where serial_number is not null`.execute(db);
    expect(serials.rows[0]!.n).toBeGreaterThan(1000);
    expect(serials.rows[0]!.distinct).toBe(serials.rows[0]!.n);
  });

  it('points every build at a location, customer, vehicle and technician of its own shop', async () => {
    const strays = await sql<{ id: number }>`
      select b.id from builds b
      left join locations l on l.id = b.location_id
      left join customers c on c.id = b.customer_id and c.location_id = b.location_id
      left join vehicles v on v.id = b.vehicle_id and v.customer_id = b.customer_id
      left join role_assignments r on r.user_id = b.lead_technician_id and r.location_id = b.location_id and r.role = 'technician'
      where l.id is null or c.id is null or v.id is null or r.id is null`.execute(db);
    expect(strays.rows).toEqual([]);
    const { rows } = await sql<{ foreign_key_check: unknown }>`pragma foreign_key_check`.execute(db);
    expect(rows).toEqual([]);
  });

  it('writes warranty claims on delivered units, numbered per shop in order, with their events and replacement lines', async () => {
    expect([counts.warrantyClaims, counts.claimEvents]).toEqual([await count('warranty_claims'), await count('claim_events')]);
    expect(counts.warrantyClaims / counts.builds).toBeGreaterThan(0.02);
    expect(counts.warrantyClaims / counts.builds).toBeLessThan(0.1);
    const numbering = await sql<{ code: string; n: number; top: number; ordered: number }>`
      select l.code, count(*) as n, max(w.sequence) as top,
        sum(w.number = l.code || '-W' || substr('0000' || w.sequence, -5)) as ordered
      from warranty_claims w join locations l on l.id = w.location_id group by l.code`.execute(db);
    expect(numbering.rows.map((r) => r.code).sort()).toEqual(['BOI', 'DEN', 'PDX']);
    for (const row of numbering.rows) expect([row.top, row.ordered]).toEqual([row.n, row.n]);
    const outOfOrder = await sql<{ id: number }>`select a.id from warranty_claims a join warranty_claims b
      on b.location_id = a.location_id and b.sequence = a.sequence + 1 where b.created_at < a.created_at`.execute(db);
    expect(outOfOrder.rows).toEqual([]);
    const strays = await sql<{ id: number }>`
      select w.id from warranty_claims w
      left join build_items i on i.id = w.build_item_id and i.build_id = w.build_id and i.serial_number is not null
      left join builds b on b.id = w.build_id and b.location_id = w.location_id and b.status = 'delivered' and b.delivered_at <= w.created_at
      left join claim_events first on first.claim_id = w.id and first.from_status is null and first.to_status = 'logged' and first.at = w.created_at
      where i.id is null or b.id is null or first.id is null
        or w.status != (select e.to_status from claim_events e where e.claim_id = w.id order by e.id desc limit 1)`.execute(db);
    expect(strays.rows).toEqual([]);
    const statuses = await sql<{ status: string }>`select distinct status from warranty_claims`.execute(db);
    expect(statuses.rows.length).toBeGreaterThanOrEqual(5);
    const replaced = await sql<{ claims: number; removed: number; lines: number }>`select
      (select count(*) from warranty_claims where replacement_item_id is not null) as claims,
      (select count(*) from build_items where removed_on is not null) as removed,
      (select count(*) from warranty_claims w join build_items r on r.id = w.replacement_item_id and r.build_id = w.build_id and r.unit_price_cents = 0
        join build_items f on f.id = w.build_item_id and f.removed_on = substr(r.created_at, 1, 10)) as lines`.execute(db);
    expect(replaced.rows[0]!.claims).toBeGreaterThan(10);
    expect([replaced.rows[0]!.removed, replaced.rows[0]!.lines]).toEqual([replaced.rows[0]!.claims, replaced.rows[0]!.claims]);
  });

  it('plans delivered builds with a house battery and a charger, and counts their units in the margin bands the plans give', async () => {
    expect([await count('power_plans'), await count('power_plan_revisions'), await count('plan_margins')]).toEqual([counts.powerPlans, counts.powerPlans, counts.powerPlans]);
    expect(counts.powerPlans / counts.builds).toBeGreaterThan(0.1);
    const strays = await sql<{ id: number }>`
      select p.id from power_plans p left join builds b on b.id = p.build_id and b.status = 'delivered' and b.number = p.name and b.location_id = p.location_id
      left join plan_margins m on m.build_id = p.build_id left join power_plan_revisions r on r.plan_id = p.id and r.version = 1 and r.input = p.input
      where b.id is null or m.build_id is null or r.id is null`.execute(db);
    expect(strays.rows).toEqual([]);
    for (const [measure, column] of [[1, 'drop_band'], [2, 'load_band'], [3, 'discharge_band']] as const) {
      const kept = await sql<{ band: number; units: number }>`select band, sum(units) as units from unit_exposure_bands where measure = ${measure} group by 1 having sum(units) != 0 order by 1`.execute(db);
      const direct = await sql<{ band: number; units: number }>`select ${sql.ref(column)} as band, sum(quantity) as units from installed_unit_source where drop_band > 0 group by 1 order by 1`.execute(db);
      expect(kept.rows, column).toEqual(direct.rows);
    }
    const drop = await sql<{ band: number }>`select distinct band from unit_exposure_bands where measure = 1 order by 1`.execute(db);
    expect(drop.rows.map((r) => r.band)).toEqual([1, 2, 3, 4]);
  });

  it('keeps the secondary indexes and triggers, rebuilt full-text indexes and the demo sign-ins', async () => {
    const fresh = openDatabase(join(dir, 'migrated-only.sqlite'));
    await migrateToLatest(fresh);
    const made = `select type, name, sql from sqlite_master where type in ('index', 'trigger') and sql is not null order by name`;
    expect((await sql.raw(made).execute(db)).rows).toEqual((await sql.raw(made).execute(fresh)).rows);
    await fresh.destroy();
    // FTS5 checks its index against the table it indexes and fails on any row missing or extra.
    const fullText = await sql<{ name: string }>`select name from sqlite_master where type = 'table' and sql like 'create virtual table%using fts5%'`.execute(db);
    for (const { name } of fullText.rows) {
      await sql`insert into ${sql.table(name)} (${sql.ref(name)}, rank) values ('integrity-check', 1)`.execute(db);
    }
    const emails = (await db.selectFrom('users').select('email').execute()).map((u) => u.email);
    expect(emails).toEqual(expect.arrayContaining(['owner@demo.busbar.test', 'lead@demo.busbar.test', 'regional@demo.busbar.test']));
    expect(new Set(emails).size).toBe(emails.length);
  });
});

describe('generated network, roll-ups', () => {
  it("keeps the network's and each region's sums of the shops' roll-ups", async () => {
    const network = await sql`select grain, period, builds_delivered, revenue_cents, claims_opened from rollup_network
      where builds_delivered <> 0 or revenue_cents <> 0 or claims_opened <> 0 order by 1, 2`.execute(db);
    const summed = await sql`select grain, period, sum(builds_delivered) as builds_delivered, sum(revenue_cents) as revenue_cents, sum(claims_opened) as claims_opened
      from rollup_figures group by 1, 2 having sum(builds_delivered) <> 0 or sum(revenue_cents) <> 0 or sum(claims_opened) <> 0 order by 1, 2`.execute(db);
    expect(network.rows.length).toBeGreaterThan(300);
    expect(network.rows).toEqual(summed.rows);
    const regions = await sql`select grain, period, region_id, builds_delivered from rollup_region where builds_delivered <> 0 order by 1, 2, 3`.execute(db);
    const byRegion = await sql`select f.grain, f.period, l.region_id, sum(f.builds_delivered) as builds_delivered from rollup_figures f join locations l on l.id = f.location_id
      group by 1, 2, 3 having sum(f.builds_delivered) <> 0 order by 1, 2, 3`.execute(db);
    expect(regions.rows).toEqual(byRegion.rows);
  });
});

describe('generated network, failure counts', () => {
  it('keeps every failure counted by age and by kind, over the network and in its region, and the workmanship claims by shop', async () => {
    const failures = Number((await sql<{ n: number }>`select count(*) as n from unit_failures`.execute(db)).rows[0]!.n);
    expect(failures).toBeGreaterThan(100);
    for (const table of ['unit_failure_ages_network', 'unit_failure_ages_region', 'unit_failure_kinds_network', 'unit_failure_kinds_region']) {
      expect((await sql<{ n: number }>`select sum(failures) as n from ${sql.table(table)}`.execute(db)).rows[0]!.n, table).toBe(failures);
    }
    const workmanship = await sql<{ n: number }>`select (select sum(failures) from unit_failure_workmanship) - (select count(*) from unit_failures where coverage = 'workmanship') as n`.execute(db);
    expect(workmanship.rows[0]!.n).toBe(0);
    const ages = await sql`select catalog_item_id, region_id, age_days, failures from unit_failure_ages_region order by 1, 2, 3`.execute(db);
    const counted = await sql`select u.catalog_item_id, l.region_id, u.failed_day - u.installed_day as age_days, count(*) as failures
      from unit_failures u join locations l on l.id = u.location_id group by 1, 2, 3 order by 1, 2, 3`.execute(db);
    expect(ages.rows).toEqual(counted.rows);
  });
});

describe('network of 200 shops', () => {
  const network = generateNetwork(seededRandom(1), 200, 1826);
  it('has unique codes, real time zones and an area for every shop', () => {
    expect(network.locations).toHaveLength(200);
    expect(new Set(network.locations.map((l) => l.code)).size).toBe(200);
    expect(new Set(network.locations.map((l) => l.name)).size).toBe(200);
    for (const location of network.locations) {
      expect(() => new Intl.DateTimeFormat('en-US', { timeZone: location.timeZone })).not.toThrow();
      expect(network.areas[location.code]?.areaCode).toMatch(/^\d{3}$/);
      expect(network.regions.map((r) => r.code)).toContain(location.region);
    }
    expect(network.locations.some((l) => l.region === 'CAN')).toBe(true);
  });
});
