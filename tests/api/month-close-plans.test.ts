import type { Db } from '@busbar/db';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { liveCloses } from '../../apps/api/src/queries/month-close-figures.ts';
import { startHarness, type Harness } from '../support/api-harness.ts';
import { plansOf } from '../support/query-plans.ts';

/**
 * SQLite's plan of a month's close on the demo's two years with statistics gathered: the month's
 * builds read by the day they were delivered and its claims by the day they were logged, never the
 * whole of either table. (On 200 shops the statistics led SQLite to every delivered build by status,
 * 5 s; the demo's do not, so for the builds this checks the day index stays usable, and the bench
 * checks the network.)
 */
let h: Harness;
beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
  await sql`pragma optimize = 0x10002`.execute(h.db);
}, 60_000);
afterAll(() => h.close());

describe('month close query plan', () => {
  it("reads a month's builds and claims by their local days", async () => {
    const text = (await plansOf(h.db, (db: Db) => liveCloses(db, '2026-05', 'all'))).flat().join('\n');
    expect(text).toMatch(/SEARCH builds USING INDEX builds_delivered_on \(delivered_on>\? AND delivered_on<\?\)/);
    expect(text).toMatch(/SEARCH warranty_claims USING INDEX warranty_claims_logged_queue \(logged_on>\? AND logged_on<\?\)/);
    expect(text).not.toMatch(/SCAN (builds|warranty_claims)\b/);
  });
});
