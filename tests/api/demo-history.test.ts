import { createHash } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { buildTotals } from '@busbar/calc';
import { migrateToLatest, openDatabase, seedDemoNetwork, type Db } from '@busbar/db';
import { CATEGORIES, SPEC_SCHEMAS, catalogItemBody, customerBody, vehicleBody, type BuildHistory, type Category } from '@busbar/shared';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDemoMonths } from '../../apps/api/src/demo-closes.ts';
import { ensureDemoData } from '../../apps/api/src/demo.ts';
import { monthClose } from '../../apps/api/src/queries/month-close.ts';
import { startHarness, type Harness } from '../support/api-harness.ts';
import { realNamesIn } from '../support/real-vehicle-names.ts';

const SERIALIZED: Category[] = ['house_battery', 'starter_battery', 'dc_dc_charger', 'solar_panel', 'solar_controller', 'inverter', 'battery_monitor', 'air_compressor'];
const HISTORY_TABLES = ['vendors', 'catalog_items', 'customers', 'vehicles', 'builds', 'build_items', 'build_events', 'audit_log', 'month_closes'];

let harness: Harness;
const dirs: string[] = [];
const freshDb = async (): Promise<Db> => {
  const dir = mkdtempSync(join(tmpdir(), 'busbar-history-'));
  dirs.push(dir);
  const db = openDatabase(join(dir, 'busbar.sqlite'));
  await migrateToLatest(db);
  return db;
};

/** The demo's history with its months before last closed, as start-up leaves it (made once, for the tests that read it). */
let closing: Promise<Db> | undefined;
const closedDemo = () =>
  (closing ??= (async () => {
    const db = await freshDb();
    await seedDemoNetwork(db, { passwordHash: 'scrypt$10$8$1$x$y', now: harness.clock.now, history: true });
    expect(await closeDemoMonths(db, harness.clock.now)).toBeGreaterThan(0);
    return db;
  })());

/** A digest of each history table, every row in id order (month closes by shop and month). */
async function fingerprint(db: Db): Promise<Record<string, string>> {
  const digests: Record<string, string> = {};
  for (const table of HISTORY_TABLES) {
    const { rows } = await sql.raw(`select * from ${table} order by ${table === 'month_closes' ? 'location_id, month' : 'id'}`).execute(db);
    digests[table] = createHash('sha256').update(JSON.stringify(rows)).digest('hex');
  }
  return digests;
}

const localDate = (zone: string, iso: string) =>
  new Intl.DateTimeFormat('en-CA', { timeZone: zone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(new Date(iso));

beforeAll(async () => {
  harness = await startHarness({}, true, { history: true });
}, 60_000);
afterAll(async () => {
  await harness.close();
  await (await closing)?.destroy();
  for (const dir of dirs) rmSync(dir, { recursive: true, force: true });
});

const builds = () =>
  harness.db.selectFrom('builds as b').innerJoin('locations as l', 'l.id', 'b.locationId').selectAll('b').select(['l.code', 'l.timeZone']).orderBy('b.id').execute();
const items = () =>
  harness.db.selectFrom('buildItems as i').innerJoin('catalogItems as c', 'c.id', 'i.catalogItemId').innerJoin('vendors as v', 'v.id', 'c.vendorId')
    .selectAll('i').select(['c.category', 'c.serialized', 'v.name as vendorName']).execute();
function groupBy<T, K>(rows: T[], key: (row: T) => K): Map<K, T[]> {
  const groups = new Map<K, T[]>();
  for (const row of rows) groups.set(key(row), [...(groups.get(key(row)) ?? []), row]);
  return groups;
}
const byShop = <T extends { code: string }>(rows: T[]) => groupBy(rows, (r) => r.code);

describe('demo history', () => {
  it('is the same for the same seed and clock, through start-up and through the harness with its months closed', async () => {
    const db = await freshDb();
    const started = performance.now();
    expect(await ensureDemoData(db, 15, harness.clock.now, dirs.at(-1)!)).toBe(true);
    console.log(`Demo seed (staff, one scrypt hash at the default cost, two years of history, months closed): ${Math.round(performance.now() - started)} ms`);
    // The harness leaves every month open for the tests of closing them; start-up closes those before last.
    const closed = await closedDemo();
    expect(await fingerprint(db)).toEqual(await fingerprint(closed));
    const { audit_log: _log, month_closes: _closes, ...sameHistory } = await fingerprint(closed);
    expect(await fingerprint(harness.db)).toMatchObject(sameHistory);
    await db.destroy();
  }, 30_000);

  it("has every month before last final at every shop, closed by the accountant on the 10th with nothing to adjust, and last month next to close", async () => {
    const db = await closedDemo();
    // The harness's clock: 15 June 2026. May is last month.
    const accountant = await db.selectFrom('users').select('id').where('email', '=', 'accountant@demo.busbar.test').executeTakeFirstOrThrow();
    const closes = await db.selectFrom('monthCloses').selectAll().execute();
    const shops = await db.selectFrom('locations').select('id').execute();
    for (const { id } of shops) {
      const months = closes.filter((c) => c.locationId === id).map((c) => c.month);
      expect(months.at(-1), `location ${id}`).toBe('2026-04');
      // In order, none missed: as many months as from the first to April.
      const [year, month] = months[0]!.split('-').map(Number) as [number, number];
      expect(months.length).toBe((2026 - year) * 12 + 4 - month + 1);
    }
    for (const c of closes) {
      expect(c.finalizedBy).toBe(accountant.id);
      expect(c.finalizedAt.slice(8, 10)).toBe('10');
      expect(JSON.parse(c.figures).adjustments).toBeNull();
      expect(c.changed).toBe(0);
    }
    const may = await monthClose(db, '2026-05', 'all', harness.clock.now);
    expect(may.locations.map((l) => [l.status, l.next, l.adjustments])).toEqual(shops.map(() => ['open', true, null]));
  }, 30_000);

  it('changes with the seed', async () => {
    const db = await freshDb();
    await seedDemoNetwork(db, { passwordHash: 'scrypt$10$8$1$x$y', now: harness.clock.now, seed: 7, history: true });
    const [other, usual] = [await fingerprint(db), await fingerprint(harness.db)];
    expect(other.builds).not.toBe(usual.builds);
    expect(other.catalog_items).toBe(usual.catalog_items);
    await db.destroy();
  }, 30_000);

  it('has invented vendors and a catalog in every category whose specs pass their schema', async () => {
    const vendors = await harness.db.selectFrom('vendors').selectAll().execute();
    expect(vendors.length >= 4 && vendors.length <= 6).toBe(true);
    for (const v of vendors) expect(v.rmaEmail).toMatch(/^[a-z]+@[a-z-]+\.test$/);
    const catalog = await harness.db.selectFrom('catalogItems').selectAll().execute();
    expect(catalog.length >= 40 && catalog.length <= 60).toBe(true);
    expect(new Set(catalog.map((c) => c.category))).toEqual(new Set(CATEGORIES));
    for (const { id, version, ...c } of catalog) {
      const specs = JSON.parse(c.specs);
      expect(SPEC_SCHEMAS[c.category].safeParse(specs).success, c.sku).toBe(true);
      expect(catalogItemBody.safeParse({ ...c, specs, serialized: c.serialized === 1, active: c.active === 1 }).success, c.sku).toBe(true);
      expect(c.unitPriceCents).toBeGreaterThan(c.unitCostCents);
      expect(c.unitCostCents).toBeGreaterThan(0);
      expect(c.serialized, c.sku).toBe(SERIALIZED.includes(c.category) ? 1 : 0);
    }
  });

  it('gives every shop customers and vehicles the API would accept, with invented makes, models and trims', async () => {
    const customers = await harness.db.selectFrom('customers').selectAll().execute();
    for (const { id, version, createdAt, ...c } of customers) expect(customerBody.safeParse(c).success, c.name).toBe(true);
    expect(new Set(customers.map((c) => c.locationId)).size).toBe(8);
    for (const field of ['email', 'phone', 'addressLine1'] as const) {
      const share = customers.filter((c) => c[field] !== '').length / customers.length;
      expect(share, field).toBeGreaterThan(0.3);
      expect(share, field).toBeLessThan(0.95);
    }
    const vehicles = await harness.db.selectFrom('vehicles').selectAll().execute();
    for (const { id, version, locationId, mileageReadOn, ...v } of vehicles) {
      expect(vehicleBody.safeParse(v).success, v.model).toBe(true);
      expect(v.vin && mileageReadOn && v.plate && v.mileage !== null, v.model).toBeTruthy();
    }
    const names = [...new Set(vehicles.map((v) => `${v.make} ${v.model}`))];
    expect(names.flatMap(realNamesIn)).toEqual([]);
  });

  it('numbers each shop\'s builds in order, staffs them from the shop and prices them with buildTotals', async () => {
    const all = await builds();
    expect(all.length).toBeGreaterThan(2000);
    for (const shopBuilds of byShop(all).values()) {
      const inOrder = [...shopBuilds].sort((a, b) => a.createdAt.localeCompare(b.createdAt) || a.id - b.id);
      expect(inOrder.map((b) => b.number)).toEqual(inOrder.map((b, i) => `${b.code}-${String(i + 1).padStart(5, '0')}`));
    }
    const misplaced = await sql<{ n: number }>`select count(*) as n from builds b join locations l on l.id = b.location_id
      where b.labor_rate_cents != l.labor_rate_cents or not exists (select 1 from role_assignments r
        where r.user_id = b.lead_technician_id and r.role = 'technician' and r.location_id = b.location_id)`.execute(harness.db);
    expect(misplaced.rows[0]!.n).toBe(0);
    const sums = await sql<{ id: number; price: number; cost: number }>`select build_id as id,
      sum(quantity * unit_price_cents) as price, sum(quantity * unit_cost_cents) as cost from build_items group by build_id`.execute(harness.db);
    const parts = new Map(sums.rows.map((s) => [s.id, s]));
    for (const b of all) {
      const { price, cost } = parts.get(b.id)!;
      const { marginCents, ...totals } = buildTotals([{ quantity: 1, unitPriceCents: price, unitCostCents: cost }], b.laborHours, b.laborRateCents);
      expect({ laborCents: b.laborCents, partsPriceCents: b.partsPriceCents, partsCostCents: b.partsCostCents, totalCents: b.totalCents }).toEqual(totals);
    }
  });

  it('records a serial on every serialized unit that went into a vehicle, unique per SKU', async () => {
    const started = new Set((await builds()).filter((b) => b.startedAt !== null).map((b) => b.id));
    const lines = await items();
    const serialized = lines.filter((i) => i.serialized === 1);
    expect(serialized.filter((i) => started.has(i.buildId)).every((i) => i.serialNumber !== null && i.quantity === 1)).toBe(true);
    expect(serialized.filter((i) => !started.has(i.buildId)).every((i) => i.serialNumber === null)).toBe(true);
    expect(lines.filter((i) => i.serialized === 0).every((i) => i.serialNumber === null)).toBe(true);
    const serials = serialized.filter((i) => i.serialNumber !== null).map((i) => `${i.sku} ${i.serialNumber}`);
    expect(serials.length).toBeGreaterThan(5000);
    expect(new Set(serials).size).toBe(serials.length);
  });

  it('keeps a status event for every change, in order and at plausible times', async () => {
    const events = groupBy(await harness.db.selectFrom('buildEvents').selectAll().where('kind', '=', 'status').orderBy('id').execute(), (e) => e.buildId);
    const now = harness.clock.now.toISOString();
    for (const b of await builds()) {
      const trail = events.get(b.id)!;
      expect(trail[0]).toMatchObject({ fromStatus: null, toStatus: 'draft', at: b.createdAt });
      trail.slice(1).forEach((e, i) => expect([e.fromStatus, e.at >= trail[i]!.at]).toEqual([trail[i]!.toStatus, true]));
      expect(trail.at(-1)).toMatchObject({ toStatus: b.status, at: b.updatedAt });
      expect(b.updatedAt <= now).toBe(true);
      const inBay = trail.find((e) => e.toStatus === 'in_bay');
      expect(b.startedAt).toBe(inBay?.at ?? null);
      if (inBay) expect([localDate(b.timeZone, inBay.at), inBay.actorId]).toEqual([b.bookedFor, b.leadTechnicianId]);
      expect(b.bookedFor !== null).toBe(trail.some((e) => e.toStatus === 'booked'));
      expect(b.deliveredAt).toBe(trail.find((e) => e.toStatus === 'delivered')?.at ?? null);
    }
  });

  it('writes the audit trail the API would have: each build created and every change of status, by the people and at the times of its events', async () => {
    const audit = groupBy(await harness.db.selectFrom('auditLog').selectAll().where('entity', '=', 'build').orderBy('id').execute(), (a) => a.entityId);
    const events = groupBy(await harness.db.selectFrom('buildEvents').selectAll().where('kind', '=', 'status').orderBy('id').execute(), (e) => e.buildId);
    const all = await builds();
    for (const b of all) {
      const trail = audit.get(b.id)!;
      expect(trail[0]).toMatchObject({ action: 'build.create', at: b.createdAt, actorId: expect.any(Number) });
      const moves = trail.filter((a) => a.action === 'build.status').map((a) => [a.at, a.actorId, JSON.parse(a.before!).status, JSON.parse(a.after!).status]);
      expect(moves).toEqual(events.get(b.id)!.slice(1).map((e) => [e.at, e.actorId, e.fromStatus, e.toStatus]));
    }
    // The history screen of a delivered build tells its whole way, creation included.
    const delivered = all.find((b) => b.status === 'delivered')!;
    const owner = await harness.signedIn('owner@demo.busbar.test');
    const history = (await owner.get(`/api/builds/${delivered.id}/history`).expect(200)).body as BuildHistory;
    expect(history.entries.filter((e) => e.kind === 'status')).toHaveLength(events.get(delivered.id)!.length);
    expect(history.entries.at(-1)).toMatchObject({ at: delivered.createdAt, summary: 'Created the build as Draft' });
    expect(history.entries.some((e) => e.kind === 'change' && e.summary.startsWith('Added '))).toBe(true);
  });

  it('is busier in summer than in winter, delivers old builds and has recent ones under way', async () => {
    const all = await builds();
    const month = (b: { bookedFor: string | null }) => Number(b.bookedFor?.slice(5, 7) ?? 0);
    const summer = all.filter((b) => [6, 7, 8].includes(month(b))).length;
    const winter = all.filter((b) => [12, 1, 2].includes(month(b))).length;
    expect(summer).toBeGreaterThan(1.5 * winter);
    const cancelled = all.filter((b) => b.status === 'cancelled');
    expect(cancelled.length / all.length).toBeGreaterThan(0.04);
    expect(cancelled.every((b) => b.startedAt === null)).toBe(true);
    const daysAgo = (b: { createdAt: string }) => (harness.clock.now.getTime() - Date.parse(b.createdAt)) / 86_400_000;
    const old = all.filter((b) => daysAgo(b) > 90);
    expect(new Set(old.map((b) => b.status))).toEqual(new Set(['delivered', 'cancelled']));
    const recent = new Set(all.filter((b) => daysAgo(b) < 21).map((b) => b.status));
    expect([...recent]).toEqual(expect.arrayContaining(['draft', 'quoted', 'booked', 'in_bay']));
  });

  it('makes the shops differ as designed', async () => {
    const all = await builds();
    const lines = await items();
    const solarBuilds = new Set(lines.filter((i) => i.category === 'solar_panel').map((i) => i.buildId));
    const shops = [...byShop(all)].map(([code, shopBuilds]) => {
      const ids = new Set(shopBuilds.map((b) => b.id));
      const batteries = lines.filter((i) => ids.has(i.buildId) && i.category === 'house_battery');
      const others = shopBuilds.filter((b) => !solarBuilds.has(b.id));
      return {
        code,
        builds: shopBuilds.length,
        first: shopBuilds[0]!.createdAt,
        hoursPerJob: others.reduce((sum, b) => sum + b.laborHours, 0) / others.length,
        solarShare: shopBuilds.filter((b) => solarBuilds.has(b.id)).length / shopBuilds.length,
        northvaneShare: batteries.filter((i) => i.vendorName.startsWith('Northvane')).reduce((s, i) => s + i.quantity, 0) / batteries.reduce((s, i) => s + i.quantity, 0),
      };
    });
    const shop = (code: string) => shops.find((s) => s.code === code)!;
    const rest = (code: string) => shops.filter((s) => s.code !== code);
    for (const other of rest('PDX')) expect(shop('PDX').hoursPerJob, other.code).toBeGreaterThan(1.3 * other.hoursPerJob);
    for (const other of rest('PHX')) expect(shop('PHX').solarShare, other.code).toBeGreaterThan(2 * other.solarShare);
    for (const other of rest('BOI')) expect(other.northvaneShare, other.code).toBeLessThan(0.5);
    expect(shop('BOI').northvaneShare).toBeGreaterThan(0.75);
    for (const other of rest('BTV')) expect(shop('BTV').builds, other.code).toBeLessThan(other.builds / 3);
    expect(Date.parse(shop('BTV').first) - Date.parse(shop('DEN').first)).toBeGreaterThan(365 * 86_400_000);
    for (const other of rest('DEN')) expect(shop('DEN').builds, other.code).toBeGreaterThan(other.builds);
    const weeks = (s: { first: string }) => (harness.clock.now.getTime() - Date.parse(s.first)) / (7 * 86_400_000);
    for (const s of shops) expect([s.code, s.builds / weeks(s) > 1.5 && s.builds / weeks(s) < 6]).toEqual([s.code, true]);
  });
});
