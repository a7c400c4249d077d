import type { Db } from '@busbar/db';
import { createQueryId, sql, type KyselyPlugin } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadViewer } from '../../apps/api/src/access/viewer.ts';
import { moneyScopes, rollupReport } from '../../apps/api/src/queries/rollups-report.ts';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { plansOf } from '../support/query-plans.ts';

/**
 * SQLite's plans for the roll-ups on the demo's history with statistics gathered: every read is of
 * a summary table (`rollup_figures f` per shop, `rollup_region f`, `rollup_network f`) by grain and
 * period (a shop's also by location); nothing walks builds, their lines or claims.
 */
let h: Harness;
let ids: Awaited<ReturnType<typeof demoIds>>;
beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
  ids = await demoIds(h.db);
  await sql`pragma optimize = 0x10002`.execute(h.db);
}, 60_000);
afterAll(() => h.close());

const YEAR_BY_MONTH = { from: '2025-07-01', to: '2026-06-30', grain: 'month' as const };

/** The plans of every statement the report sends. */
async function planText(email: string, scope: 'all' | number[]) {
  const viewer = (await loadViewer(h.db, ids.user(email)))!;
  return (await plansOf(h.db, (db: Db) => rollupReport(db, YEAR_BY_MONTH, scope, moneyScopes(viewer)))).map((lines) => lines.join('\n'));
}

/** The tables each statement of the report reads as `f`, in the order sent. */
async function tablesRead(email: string, scope: 'all' | number[], rows?: 'none') {
  const viewer = (await loadViewer(h.db, ids.user(email)))!;
  const read: string[] = [];
  const recorder: KyselyPlugin = {
    transformQuery: ({ node }) => {
      read.push(h.db.getExecutor().compileQuery(node, createQueryId()).sql.match(/"?(rollup_\w+)"? f\b/)?.[1] ?? '?');
      return node;
    },
    transformResult: async ({ result }) => result,
  };
  await rollupReport(h.db.withPlugin(recorder), { ...YEAR_BY_MONTH, rows }, scope, moneyScopes(viewer));
  return read.filter((table) => table !== '?');
}

describe('roll-up query plans', () => {
  it("the network's and whole regions' sums are read from their kept rows, not summed from every shop's", async () => {
    expect(await tablesRead('owner@demo.busbar.test', 'all', 'none')).toEqual(['rollup_region', 'rollup_network']);
    const region = ids.locations.filter((l) => l.regionId === ids.locations.find((m) => m.code === 'DEN')!.regionId).map((l) => l.id);
    // A regional manager's rows, regions, network and scope (the sum of their whole region).
    expect(await tablesRead('regional@demo.busbar.test', region)).toEqual(['rollup_figures', 'rollup_region', 'rollup_network', 'rollup_region']);
    expect(await tablesRead('lead@demo.busbar.test', [ids.location('DEN')], 'none')).toEqual(['rollup_region', 'rollup_network', 'rollup_figures']);
  });

  it('the whole network reads the summary table by grain and period', async () => {
    const plans = await planText('owner@demo.busbar.test', 'all');
    const text = plans.join('\n');
    expect(text).toMatch(/SEARCH f USING PRIMARY KEY \(grain=\? AND period=\?\)/);
    expect(text).not.toMatch(/\b(builds|build_items|warranty_claims|catalog_items)\b/);
    expect(text).not.toMatch(/SCAN (rollup_figures|f)\b/);
  });

  it("a shop's roll-ups read its own rows by grain, period and location, and the network's by grain and period", async () => {
    const plans = await planText('lead@demo.busbar.test', [ids.location('DEN')]);
    const text = plans.join('\n');
    expect(text).toMatch(/SEARCH f USING PRIMARY KEY \(grain=\? AND period=\? AND location_id=\?\)/);
    expect(text).not.toMatch(/\b(builds|build_items|warranty_claims|catalog_items)\b/);
    expect(text).not.toMatch(/SCAN (rollup_figures|f)\b/);
  });
});
