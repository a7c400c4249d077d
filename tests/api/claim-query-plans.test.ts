import type { Db } from '@busbar/db';
import { claimQuery } from '@busbar/shared';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listClaims, SORTED_SPAN_MOST } from '../../apps/api/src/queries/claim-list.ts';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { plansOf } from '../support/query-plans.ts';

/**
 * SQLite's plan for the claims list on the demo network's history with a claim on every tenth
 * unit and statistics gathered: claims are read through an index, a page in the queue's order
 * without sorting every claim.
 */
let h: Harness;
let den: number;

beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
  den = (await demoIds(h.db)).location('DEN');
  // A claim on every tenth delivered unit, failing and logged across two years, a fifth closed.
  await sql`insert into warranty_claims (location_id, sequence, number, build_id, build_item_id, catalog_item_id, failed_on, failure_mode, coverage, symptoms, status, due_on, created_at, logged_on, updated_at)
    select b.location_id, 1000000 + i.id, 'T-' || i.id, b.id, i.id, i.catalog_item_id, date('2024-07-01', '+' || (i.id % 700) || ' days'), 'overheating', 'vendor_defect', 'Hot',
      case when i.id % 5 = 0 then 'closed' else 'sent_to_vendor' end, case when i.id % 5 = 0 then null else date('2026-01-01', '+' || (i.id % 200) || ' days') end,
      strftime('%Y-%m-%dT%H:%M:%fZ', '2024-07-02', '+' || (i.id % 700) || ' days'), date('2024-07-02', '+' || (i.id % 700) || ' days'), '2026-06-01T00:00:00.000Z'
    from build_items i join builds b on b.id = i.build_id where b.status = 'delivered' and i.id % 10 = 0`.execute(h.db);
  await sql`pragma optimize = 0x10002`.execute(h.db);
}, 120_000);
afterAll(() => h.close());

/** Lists whose page is read in the queue's order straight from an index, stopping at the page. */
const IN_ORDER: Record<string, Record<string, string>> = {
  'the queue': {},
  'one status': { status: 'sent_to_vendor' },
  overdue: { overdue: 'true' },
  'a deep page': { page: '40' },
};

/** Lists narrowed to a vendor's or a category's items: read in the queue's order, or from the items' own index. */
const BY_ITEM: Record<string, Record<string, string>> = {
  'a vendor': { vendorId: '1' },
  'a category': { category: 'house_battery' },
};

/** Lists narrowed to a span of days: the span is read from its index, and only its claims are sorted. */
const BY_DAYS: Record<string, [query: Record<string, string>, column: string]> = {
  'failed in a month': [{ failedFrom: '2025-03-01', failedTo: '2025-03-31' }, 'failed_on'],
  'logged in a month': [{ loggedFrom: '2025-03-01', loggedTo: '2025-03-31' }, 'logged_on'],
};

const AT = new Date('2026-06-15T15:00:00Z');

/**
 * Whether a plan may be the page's ids: it reads the claims, not by id (the page's names) and not as
 * the count (a co-routine). The count comes first, and its subquery is planned on its own before it:
 * the page's ids are the last such plan.
 */
const readsPage = (lines: string[]) =>
  lines.some((line) => /^(SCAN|SEARCH) w\b/.test(line) && !line.includes('INTEGER PRIMARY KEY')) && !lines.some((line) => line.includes('CO-ROUTINE'));

/** The plans of a claims list: every statement, and the one that reads the page's ids. */
async function listPlans(scope: 'all' | number[], query: Record<string, string>) {
  const plans = await plansOf(h.db, (db) => listClaims(db, scope, claimQuery.parse(query), AT));
  const page = plans.filter(readsPage).at(-1);
  return { plans, page: page ?? [] };
}

/** Statements that read a table row by row, not through an index. */
const tableScans = (plans: string[][]) => plans.flat().filter((line) => /^SCAN (w|i|b|ci)\b/.test(line) && !/USING (COVERING )?INDEX/.test(line));

/** The shops of Denver's region. */
async function denverRegion(): Promise<number[]> {
  const { locations } = await demoIds(h.db);
  const denver = locations.find((l) => l.code === 'DEN')!;
  return locations.filter((l) => l.regionId === denver.regionId).map((l) => l.id);
}

/** The ids of a page of the region's claims (failed or logged in `days`, when given) in the queue's order, found by a plain query. */
function queuePageByHand(db: Db, region: number[], page: { page: number; pageSize: number }, days?: { column: string; from: string; to?: string }) {
  let claims = db.selectFrom('warrantyClaims').select('id').where('locationId', 'in', region);
  if (days) claims = claims.where(sql.ref(days.column), '>=', days.from);
  if (days?.to) claims = claims.where(sql.ref(days.column), '<=', days.to);
  return claims.orderBy(sql`due_on is null`).orderBy('dueOn').orderBy('id').limit(page.pageSize).offset((page.page - 1) * page.pageSize).execute();
}

describe('claims list query plans', () => {
  it('has claims to plan for', async () => {
    const { n } = await h.db.selectFrom('warrantyClaims').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
    expect(Number(n)).toBeGreaterThan(1000);
  });

  it.each(Object.entries(IN_ORDER))("reads a network-wide page in the queue's order from an index, sorting nothing: %s", async (_name, query) => {
    const { plans, page } = await listPlans('all', query);
    expect(page.join('\n')).toMatch(/USING (COVERING )?INDEX warranty_claims_(status_)?queue_order/);
    expect(page.filter((line) => line.includes('TEMP B-TREE'))).toEqual([]);
    expect(tableScans(plans)).toEqual([]);
  });

  it.each(Object.entries(BY_ITEM))("reads a network-wide page of some items' claims from an index, never each claim's unit: %s", async (_name, query) => {
    const { plans, page } = await listPlans('all', query);
    expect(page.join('\n')).toMatch(/USING (COVERING )?INDEX warranty_claims_(queue_order|item_queue_order \(catalog_item_id=\?)/);
    expect(page.filter((line) => /\b(build_items|i)\b/.test(line))).toEqual([]);
    expect(tableScans(plans)).toEqual([]);
  });

  it.each(Object.entries(BY_DAYS))("reads a network-wide span of days from its index, which holds the queue's order: %s", async (_name, [query, column]) => {
    const { plans, page } = await listPlans('all', query);
    expect(page.some((line) => line.startsWith('SEARCH w USING COVERING INDEX') && line.includes(`${column}>? AND ${column}<?`)), page.join('\n')).toBe(true);
    expect(tableScans(plans)).toEqual([]);
  });

  it.each(Object.entries(BY_ITEM))("counts a region's claims of some items from an index alone, never reading each claim for its shop: %s", async (_name, query) => {
    const region = await denverRegion();
    expect(region.length).toBeGreaterThan(1);
    const { plans } = await listPlans(region, query);
    const count = plans.find((lines) => lines.some((line) => line.includes('CO-ROUTINE')))!;
    expect(count.filter((line) => /^SEARCH w\b/.test(line))).toEqual([expect.stringMatching(/^SEARCH w USING COVERING INDEX warranty_claims_item_location \(catalog_item_id=\? AND location_id=\?\)/)]);
    expect(tableScans(plans)).toEqual([]);
  });

  it("counts a region's claims logged in a month by each shop's span of logging days in an index alone, never reading each claim for its shop", async () => {
    const region = await denverRegion();
    const { plans } = await listPlans(region, BY_DAYS['logged in a month']![0]);
    const count = plans.find((lines) => lines.some((line) => line.includes('CO-ROUTINE')))!;
    expect(count.filter((line) => /^SEARCH w\b/.test(line))).toEqual([expect.stringMatching(/^SEARCH w USING COVERING INDEX \w+ \(location_id=\? AND logged_on>\? AND logged_on<\?\)/)]);
    expect(tableScans(plans)).toEqual([]);
  });

  it.each(Object.entries(BY_DAYS))("reads a whole region's page of a span of days from its shops' spans in an index alone: %s", async (_name, [query, column]) => {
    const region = await denverRegion();
    const { plans, page } = await listPlans(region, query);
    expect(page.filter((line) => /^(SCAN|SEARCH) w\b/.test(line))).toEqual([expect.stringMatching(new RegExp(`^SEARCH w USING COVERING INDEX \\w+ \\(location_id=\\? AND ${column}>\\? AND ${column}<\\?\\)$`))]);
    expect(tableScans(plans)).toEqual([]);
    const listed = await listClaims(h.db, region, claimQuery.parse(query), AT);
    const byHand = await queuePageByHand(h.db, region, listed, { column, from: Object.values(query)[0]!, to: Object.values(query)[1]! });
    expect(listed.items.map((c) => c.id)).toEqual(byHand.map((c) => c.id));
    expect(listed.items.length).toBeGreaterThan(0);
  });

  it("walks the network's queue order for a region's span of days holding more claims than are worth sorting", async () => {
    const region = await denverRegion();
    const span = claimQuery.parse({ failedFrom: '2024-01-01' });
    const rolledBack = new Error('rolled back');
    await expect(
      h.db.transaction().execute(async (trx) => {
        // Copies of the claims (undone after) until the region's span holds more than SORTED_SPAN_MOST.
        for (let copy = 1; (await listClaims(trx, region, span, AT)).total <= SORTED_SPAN_MOST; copy++) {
          await sql`insert into warranty_claims (location_id, sequence, number, build_id, build_item_id, catalog_item_id, failed_on, failure_mode, coverage, symptoms, status, due_on, created_at, logged_on, updated_at)
            select location_id, sequence + ${copy * 10_000_000}, number || '-' || ${copy}, build_id, build_item_id, catalog_item_id, failed_on, failure_mode, coverage, symptoms, status, due_on, created_at, logged_on, updated_at
            from warranty_claims where sequence < 10000000`.execute(trx);
        }
        const plans = await plansOf(trx, (db) => listClaims(db, region, span, AT));
        const page = plans.filter(readsPage).at(-1)!;
        expect(page.filter((line) => /^(SCAN|SEARCH) w\b/.test(line))).toEqual(['SCAN w USING INDEX warranty_claims_queue_order']);
        const listed = await listClaims(trx, region, span, AT);
        const byHand = await queuePageByHand(trx, region, listed, { column: 'failed_on', from: '2024-01-01' });
        expect(listed.items.map((c) => c.id)).toEqual(byHand.map((c) => c.id));
        throw rolledBack;
      }),
    ).rejects.toBe(rolledBack);
  });

  it.each([['the queue', {}], ['a deep page', { page: '4' }]])(
    "walks the network's queue order for a whole region's page instead of sorting all its claims: %s",
    async (_name, query) => {
      const region = await denverRegion();
      const { plans, page } = await listPlans(region, query);
      expect(page).toEqual(['SCAN w USING INDEX warranty_claims_queue_order']);
      // Its count still seeks each shop's claims.
      const count = plans.find((lines) => lines.some((line) => line.includes('CO-ROUTINE')))!;
      expect(count.join('\n')).toMatch(/SEARCH w USING COVERING INDEX \w+ \(location_id=\?\)/);
      const listed = await listClaims(h.db, region, claimQuery.parse(query), AT);
      const byHand = await queuePageByHand(h.db, region, listed);
      expect(listed.items.map((c) => c.id)).toEqual(byHand.map((c) => c.id));
      expect(listed.items).toHaveLength(listed.pageSize);
    },
  );

  it("counts the network's overdue claims by each shop's own day, from one range of an index", async () => {
    // 05:30 UTC: the 10th in the eastern shops, still the 9th in the western ones.
    const straddle = new Date('2026-03-10T05:30:00Z');
    const dayAt = (timeZone: string) => new Intl.DateTimeFormat('en-CA', { timeZone }).format(straddle);
    const zones = new Map((await h.db.selectFrom('locations').select(['id', 'timeZone']).execute()).map((l) => [l.id, dayAt(l.timeZone)]));
    const rolledBack = new Error('rolled back');
    await expect(
      h.db.transaction().execute(async (trx) => {
        // A third of the claims open again, due on a day of March 1 to 20 (undone after).
        await sql`update warranty_claims set status = 'sent_to_vendor', due_on = date('2026-03-01', '+' || (id % 20) || ' days') where id % 3 = 0`.execute(trx);
        const plans = await plansOf(trx, (db) => listClaims(db, 'all', claimQuery.parse({ overdue: 'true' }), straddle));
        const count = plans.find((lines) => lines.some((line) => line.includes('CO-ROUTINE')))!;
        // One range of due days (skipping through the few shops, or the due-day index with the shop), no seek per shop in turn.
        expect(count.filter((line) => /^(SCAN|SEARCH) w\b|INDEX \d+/.test(line))).toEqual([
          expect.stringMatching(/^SEARCH w USING COVERING INDEX warranty_claims_due\w* \((ANY\(location_id\) AND )?due_on<\?\)$/),
        ]);

        const due = await trx.selectFrom('warrantyClaims').select(['id', 'locationId', 'dueOn']).where('dueOn', 'is not', null).orderBy('dueOn').orderBy('id').execute();
        const overdue = due.filter((c) => c.dueOn! < zones.get(c.locationId)!);
        // Claims due on the 9th are overdue in the east only: the shop's zone decides.
        expect(due.filter((c) => c.dueOn! < '2026-03-09').length).toBeLessThan(overdue.length);
        expect(overdue.length).toBeLessThan(due.filter((c) => c.dueOn! < '2026-03-10').length);
        const listed = await listClaims(trx, 'all', claimQuery.parse({ overdue: 'true', pageSize: '100' }), straddle);
        expect(listed.total).toBe(overdue.length);
        expect(listed.items.map((c) => c.id)).toEqual(overdue.slice(0, 100).map((c) => c.id));
        throw rolledBack;
      }),
    ).rejects.toBe(rolledBack);
  });

  // A shop's claims are few: whichever index the statistics choose (the shop's, or a status's in order), nothing is read whole.
  it.each([...Object.entries(IN_ORDER), ...Object.entries(BY_ITEM), ...Object.entries(BY_DAYS).map(([name, [query]]) => [name, query] as const)])(
    "reads a lead's page by searching an index: %s",
    async (_name, query) => {
      const { plans, page } = await listPlans([den], query);
      expect(page[0]).toMatch(/^SEARCH w USING (COVERING )?INDEX \w+ \((location_id|status|catalog_item_id=\? AND location_id)=\?/);
      expect(tableScans(plans)).toEqual([]);
    },
  );
});
