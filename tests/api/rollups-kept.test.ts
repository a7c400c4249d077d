import type { Db } from '@busbar/db';
import { CATEGORIES } from '@busbar/shared';
import fc from 'fast-check';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MIX_CATEGORIES } from '../../db/migrations/021-create-rollups.ts';
import { REFILL_ROLLUPS } from '../../db/migrations/042-create-rollup-sums.ts';
import { refillRollups } from '../../apps/api/src/queries/rollups-refill.ts';
import { startHarness, type Harness } from '../support/api-harness.ts';
import { afterRefill, rolledBack } from '../support/kept-tables.ts';
import { anyChange, apply, smallNetwork } from '../support/kept-changes.ts';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
  await smallNetwork(h.db);
});
afterAll(() => h.close());

/** The kept table without its emptied rows, in key order. */
async function keptTables(db: Db) {
  const rows = await sql<Record<string, unknown>>`select * from rollup_figures order by 1, 2, 3`.execute(db);
  const key = ['grain', 'period', 'locationId'];
  return rows.rows.filter((row) => Object.entries(row).some(([column, value]) => !key.includes(column) && value !== 0));
}

const refilled = (db: Db) => afterRefill(db, REFILL_ROLLUPS, keptTables);

/** The network's and the regions' kept sums (migration 042), and the same summed from the locations' rows; neither with emptied rows. */
async function networkAndRegions(db: Db) {
  const { rows } = await sql<{ name: string }>`select name from pragma_table_info('rollup_figures')`.execute(db);
  const figures = rows.map((r) => r.name).filter((name) => !['grain', 'period', 'location_id'].includes(name));
  const any = (of: (f: string) => string) => figures.map((f) => `${of(f)} <> 0`).join(' or ');
  const read = async (query: string) => (await sql.raw<Record<string, unknown>>(query).execute(db)).rows;
  const summed = figures.map((f) => `sum(f.${f}) as ${f}`).join(', ');
  return {
    kept: {
      network: await read(`select grain, period, ${figures.join(', ')} from rollup_network where ${any((f) => f)} order by 1, 2`),
      regions: await read(`select grain, period, region_id, ${figures.join(', ')} from rollup_region where ${any((f) => f)} order by 1, 2, 3`),
    },
    summed: {
      network: await read(`select f.grain, f.period, ${summed} from rollup_figures f group by 1, 2 having ${any((f) => `sum(f.${f})`)} order by 1, 2`),
      regions: await read(`select f.grain, f.period, l.region_id, ${summed} from rollup_figures f join locations l on l.id = f.location_id
        group by 1, 2, 3 having ${any((f) => `sum(f.${f})`)} order by 1, 2, 3`),
    },
  };
}

async function expectSumsAgree(db: Db) {
  const { kept, summed } = await networkAndRegions(db);
  expect(kept).toEqual(summed);
  return kept;
}

describe('the roll-up table follows every change', () => {
  it('has a job-mix column for every category of the catalog', () => {
    expect(MIX_CATEGORIES).toEqual([...CATEGORIES]);
  });

  it('match a refill from scratch after any mix of creates, edits, status changes, cancellations, corrections, claims and imports', async () => {
    const change = await anyChange(h.db);
    const before = await keptTables(h.db);
    expect(before).toEqual(await refilled(h.db));
    expect(before.length).toBeGreaterThan(100);
    expect((await expectSumsAgree(h.db)).regions.length).toBeGreaterThan(40);
    await fc.assert(
      fc.asyncProperty(fc.array(change, { minLength: 1, maxLength: 15 }), async (changes) => {
        await rolledBack(h.db, async () => {
          for (const c of changes) await apply(h.db, c);
          expect(await keptTables(h.db)).toEqual(await refilled(h.db));
          await expectSumsAgree(h.db);
        });
      }),
      { seed: 10_021, numRuns: 120 },
    );
  }, 60_000);

  it("keeps the regions' sums when a location moves to another region", async () => {
    const locations = await h.db.selectFrom('locations').select(['id', 'regionId']).orderBy('id').execute();
    const moved = locations[0]!;
    const other = locations.find((l) => l.regionId !== moved.regionId)!;
    const before = await expectSumsAgree(h.db);
    await rolledBack(h.db, async () => {
      await h.db.updateTable('locations').set({ regionId: other.regionId }).where('id', '=', moved.id).execute();
      const after = await expectSumsAgree(h.db);
      expect(after.network).toEqual(before.network);
      expect(after.regions).not.toEqual(before.regions);
    });
  });

  it('is rebuilt by the refill command after it was changed behind the triggers', async () => {
    const kept = await keptTables(h.db);
    await sql`delete from rollup_figures where grain = 'month'`.execute(h.db);
    await sql`update rollup_figures set revenue_cents = 0 where grain = 'day'`.execute(h.db);
    await sql`update rollup_network set builds_delivered = builds_delivered + 1`.execute(h.db);
    await sql`delete from rollup_region where grain = 'week'`.execute(h.db);
    expect(await keptTables(h.db)).not.toEqual(kept);
    await refillRollups(h.db);
    expect(await keptTables(h.db)).toEqual(kept);
    await expectSumsAgree(h.db);
  });
});
