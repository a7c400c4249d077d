import type { Db } from '@busbar/db';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadViewer } from '../../apps/api/src/access/viewer.ts';
import { moneyScopes, rollupReport } from '../../apps/api/src/queries/rollups-report.ts';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { plansOf } from '../support/query-plans.ts';

/**
 * SQLite's plans for the roll-ups on the demo's history with statistics gathered: every read is of
 * the summary table (`rollup_figures f`) by grain and period (a shop's also by location); nothing
 * walks builds, their lines or claims.
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

describe('roll-up query plans', () => {
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
