import { dayOfIso } from '@busbar/calc';
import type { Db } from '@busbar/db';
import { createQueryId, sql, type KyselyPlugin } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { reliabilityDetail } from '../../apps/api/src/reliability/detail.ts';
import { reliabilityList } from '../../apps/api/src/reliability/list.ts';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { plansOf } from '../support/query-plans.ts';

/**
 * SQLite's plans for the reliability screens on the demo's history with statistics gathered: the
 * whole network reads the per-item sums, a shop or a region its own cells through their index,
 * one item its sums and kept failure counts by item, a funnel each shop's lifetime sums; nothing
 * walks builds, build lines or claims.
 */
let h: Harness;
let ids: Awaited<ReturnType<typeof demoIds>>;
beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
  ids = await demoIds(h.db);
  await sql`pragma optimize = 0x10002`.execute(h.db);
}, 60_000);
afterAll(() => h.close());

const TODAY = { today: '2026-06-15', todayDay: dayOfIso('2026-06-15') };
const planText = (plans: string[][]) => plans.flat().join('\n');

/** The table each statement `run` sends reads first (its FROM, after any common table expression). */
async function tablesOf(run: (db: Db) => Promise<unknown>): Promise<string[]> {
  const tables: string[] = [];
  const recorder: KyselyPlugin = {
    transformQuery: ({ node }) => {
      tables.push(h.db.getExecutor().compileQuery(node, createQueryId()).sql.match(/^(?:with [\s\S]*?\) )?select [\s\S]*? from "(\w+)"/)?.[1] ?? '?');
      return node;
    },
    transformResult: async ({ result }) => result,
  };
  await run(h.db.withPlugin(recorder));
  return tables;
}

describe('reliability query plans', () => {
  it('the network list reads the per-item sums only, item by item', async () => {
    const run = (db: typeof h.db) => reliabilityList(db, 'all', { groupBy: 'item' }, TODAY.today, TODAY.todayDay);
    expect(await tablesOf(run)).toEqual(['catalog_items', 'vendors', 'unit_exposure_network']);
    const plans = planText(await plansOf(h.db, run));
    expect(plans).toMatch(/SEARCH x USING PRIMARY KEY \(catalog_item_id=\?\)/);
    expect(plans).not.toMatch(/SCAN x\b/);
  });

  it("a shop's list reads its own cells through the location index, and the network's sums for the peers", async () => {
    const run = (db: typeof h.db) => reliabilityList(db, [ids.location('DEN')], { groupBy: 'category' }, TODAY.today, TODAY.todayDay);
    expect(await tablesOf(run)).toEqual(['catalog_items', 'vendors', 'locations', 'unit_exposure', 'unit_exposure_network']);
    const plans = planText(await plansOf(h.db, run));
    expect(plans).toMatch(/SEARCH x USING COVERING INDEX unit_exposure_location \(location_id=\? AND catalog_item_id=\?\)/);
    expect(plans).not.toMatch(/SCAN x\b/);
  });

  it("a whole region's list and category read the region's sums; part of a region reads its shops' cells", async () => {
    const denver = await h.db.selectFrom('locations').select('regionId').where('id', '=', ids.location('DEN')).executeTakeFirstOrThrow();
    const region = (await h.db.selectFrom('locations').select('id').where('regionId', '=', denver.regionId).execute()).map((l) => l.id);
    expect(region.length).toBeGreaterThan(1);
    const list = (scope: number[]) => (db: typeof h.db) => reliabilityList(db, scope, { groupBy: 'item' }, TODAY.today, TODAY.todayDay);
    expect(await tablesOf(list(region))).toEqual(['catalog_items', 'vendors', 'locations', 'unit_exposure_region', 'unit_exposure_network']);
    const plans = planText(await plansOf(h.db, list(region)));
    expect(plans).toMatch(/SEARCH x USING PRIMARY KEY \(catalog_item_id=\? AND region_id=\?\)/);
    expect(plans).not.toMatch(/SCAN x\b/);
    expect(await tablesOf(list(region.slice(1)))).toEqual(['catalog_items', 'vendors', 'locations', 'unit_exposure', 'unit_exposure_network']);
    const category = (db: typeof h.db) =>
      reliabilityDetail(db, { groupBy: 'category', key: 'house_battery' }, region, [], {}, TODAY.today, TODAY.todayDay);
    const read = await tablesOf(category);
    expect(read).toEqual(expect.arrayContaining(['unit_exposure_region', 'unit_exposure_bands_region', 'unit_failure_ages_region', 'unit_failure_kinds_region']));
    expect(read).not.toContain('unit_exposure_bands');
  });

  it("one item's view reads its sums and kept failure counts by item, never a shop's cells", async () => {
    const item = await h.db.selectFrom('catalogItems').select('id').where('sku', '=', 'TDW-DC40').executeTakeFirstOrThrow();
    const run = (db: typeof h.db) => reliabilityDetail(db, { groupBy: 'item', key: item.id }, 'all', [], {}, TODAY.today, TODAY.todayDay);
    const plans = planText(await plansOf(h.db, run));
    // The months (the network's sums, whose total is the figures), the failure ages and kinds (kept
    // counts), the funnel (each shop's lifetime sums) and the margin bands of planned builds.
    const tables = await tablesOf(run);
    expect(tables).toEqual(expect.arrayContaining(['unit_exposure_network', 'unit_failure_ages_network', 'unit_failure_kinds_network', 'unit_exposure_lifetime', 'unit_exposure_bands_network']));
    expect(tables).not.toContain('unit_exposure');
    expect(plans.match(/SEARCH (x|unit_failure_ages_network|unit_failure_kinds_network) USING PRIMARY KEY \(catalog_item_id=\?\)/g)).toHaveLength(5);
    expect(plans).not.toMatch(/SCAN (x|unit_exposure|unit_failures|unit_failure_\w+)\b/);
    expect(plans).not.toMatch(/builds|build_items|warranty_claims/);
  });

  it("a shop's category seeks the shop's failures of its items; asked for months, the funnel's workmanship claims are sought by item", async () => {
    const category = (query: { from?: string; to?: string }) => (db: typeof h.db) =>
      reliabilityDetail(db, { groupBy: 'category', key: 'house_battery' }, [ids.location('DEN')], [], query, TODAY.today, TODAY.todayDay);
    const readsOf = async (query: { from?: string; to?: string }) => (await plansOf(h.db, category(query))).flat().filter((line) => /^(SEARCH|SCAN) unit_failures\b/.test(line));
    // The failure ages (on 200 shops the claim shares too: on the demo's 8 the item's index is as good).
    const reads = await readsOf({});
    expect(reads, reads.join('\n')).toContain('SEARCH unit_failures USING COVERING INDEX unit_failures_location (location_id=? AND catalog_item_id=?)');
    // Every shop's workmanship claims over every install month are counted already.
    expect(await tablesOf(category({}))).toContain('unit_failure_workmanship');
    expect(reads.filter((line) => line.startsWith('SCAN') || line.includes('ANY(') || line.includes('coverage=?'))).toEqual([]);
    // Some months: the workmanship claims sought by item, never a skip through every shop's.
    const months = await readsOf({ from: '2025-01', to: '2026-06' });
    expect(months.some((line) => line.includes('(catalog_item_id=?'))).toBe(true);
    expect(months.filter((line) => line.startsWith('SCAN') || line.includes('ANY('))).toEqual([]);
  });

  it("a category's funnel reads each shop's lifetime sums and workmanship claims, and its failure ages and kinds the kept counts", async () => {
    const run = (db: typeof h.db) => reliabilityDetail(db, { groupBy: 'category', key: 'house_battery' }, 'all', [], {}, TODAY.today, TODAY.todayDay);
    const tables = await tablesOf(run);
    expect(tables).toEqual(expect.arrayContaining(['unit_exposure_lifetime', 'unit_failure_ages_network', 'unit_failure_kinds_network', 'unit_failure_workmanship']));
    expect(tables).not.toContain('unit_exposure');
    // No failure is read one by one.
    expect((await plansOf(h.db, run)).flat().filter((line) => /^(SEARCH|SCAN) unit_failures\b/.test(line))).toEqual([]);
  });
});
