import type { Db } from '@busbar/db';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDemoMonths } from '../../apps/api/src/demo-closes.ts';
import { liveCloses } from '../../apps/api/src/queries/month-close-figures.ts';
import { monthClose } from '../../apps/api/src/queries/month-close.ts';
import { startHarness, type Harness } from '../support/api-harness.ts';
import { plansOf } from '../support/query-plans.ts';

/**
 * SQLite's plan of a month's close on the demo's two years with statistics gathered: each shop's
 * delivered builds and claims logged of the month sought through the indexes of their sums, never
 * the whole of either table; and, with its months closed, never every final month.
 */
let h: Harness;
beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
  await sql`pragma optimize = 0x10002`.execute(h.db);
}, 60_000);
afterAll(() => h.close());

describe('month close query plan', () => {
  it("reads each shop's month of builds and of claims from the indexes of their sums", async () => {
    const text = (await plansOf(h.db, (db: Db) => liveCloses(db, '2026-05', 'all'))).flat().join('\n');
    expect(text).toMatch(/SEARCH builds USING COVERING INDEX builds_delivered_sums \(location_id=\? AND delivered_on>\? AND delivered_on<\?\)/);
    // In shop order: grouped as they come, not sorted first.
    expect(text).not.toMatch(/SEARCH (builds|warranty_claims) [^\n]*\nUSE TEMP B-TREE/);
    expect(text).toMatch(/SEARCH warranty_claims USING COVERING INDEX warranty_claims_logged_sums \(location_id=\? AND logged_on>\? AND logged_on<\?\)/);
    expect(text).not.toMatch(/SCAN (builds|warranty_claims)\b/);
    // A region's shops only: their own builds and claims, not the network's month.
    const region = (await plansOf(h.db, (db: Db) => liveCloses(db, '2026-05', [1, 2]))).flat().join('\n');
    expect(region).toMatch(/SEARCH bl USING INTEGER PRIMARY KEY \(rowid=\?\)\n[^\n]*SEARCH builds USING COVERING INDEX builds_delivered_sums \(location_id=\? AND/);
    expect(region).toMatch(/SEARCH cl USING INTEGER PRIMARY KEY \(rowid=\?\)\n[^\n]*SEARCH warranty_claims USING COVERING INDEX warranty_claims_logged_sums \(location_id=\? AND/);
  });

  it("finds a month's finals by month, each shop's last final by one seek, and changed final months by their flag, never every final month", async () => {
    // The demo's months through April closed, as start-up closes them (the harness's clock stands in June).
    expect(await closeDemoMonths(h.db, h.clock.now)).toBeGreaterThan(100);
    await sql`pragma optimize = 0x10002`.execute(h.db);
    for (const month of ['2026-04', '2026-05']) {
      const text = (await plansOf(h.db, (db: Db) => monthClose(db, month, 'all', h.clock.now))).flat().join('\n');
      expect(text).toMatch(/SEARCH c USING (COVERING )?INDEX month_closes_month \(month=\?\)/);
      expect(text).toMatch(/SEARCH c USING PRIMARY KEY \(location_id=\?\)/);
      expect(text).not.toMatch(/SCAN (c|month_closes)\b/);
      // May is every shop's next: its changed final months are read through their flag.
      if (month === '2026-05') expect(text).toMatch(/SEARCH c USING INDEX month_closes_changed \(location_id=\?\)/);
    }
  });
});
