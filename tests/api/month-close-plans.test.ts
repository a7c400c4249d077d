import type { Db } from '@busbar/db';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDemoMonths } from '../../apps/api/src/demo-closes.ts';
import { closeStatus } from '../../apps/api/src/queries/close-status.ts';
import { liveCloses } from '../../apps/api/src/queries/month-close-figures.ts';
import { monthClose } from '../../apps/api/src/queries/month-close.ts';
import { startHarness, type Harness } from '../support/api-harness.ts';
import { plansOf } from '../support/query-plans.ts';

/**
 * SQLite's plan of a month's close on the demo's two years with statistics gathered: each shop's
 * month read from its kept sums, never builds or claims; and, with its months closed, never every
 * final month.
 */
let h: Harness;
beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
  await sql`pragma optimize = 0x10002`.execute(h.db);
}, 60_000);
afterAll(() => h.close());

describe('month close query plan', () => {
  it("reads each shop's month from its kept sums by month and shop, never builds or claims", async () => {
    for (const scope of ['all', [1, 2]] as const) {
      const text = (await plansOf(h.db, (db: Db) => liveCloses(db, '2026-05', scope === 'all' ? scope : [...scope]))).flat().join('\n');
      expect(text).toMatch(/SEARCH k USING PRIMARY KEY \(month=\? AND location_id=\?\)/);
      expect(text).not.toMatch(/\b(builds|warranty_claims)\b/);
      expect(text).not.toMatch(/SCAN k\b/);
    }
  });

  it("finds a month's finals by month, each shop's last final by one seek, changed final months by their flag, and a range's finals shop by shop, never every final month", async () => {
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
    // The close status: each shop's final months of the range and its last final, by seeks per shop.
    const status = (await plansOf(h.db, (db: Db) => closeStatus(db, '2025-06', '2026-05', 'all', h.clock.now))).flat().join('\n');
    expect(status).toMatch(/SEARCH c USING PRIMARY KEY \(location_id=\? AND month>\? AND month<\?\)/);
    expect(status).toMatch(/SEARCH c USING PRIMARY KEY \(location_id=\?\)/);
    expect(status).not.toMatch(/SCAN (c|month_closes)\b|month_closes_month/);
  });
});
