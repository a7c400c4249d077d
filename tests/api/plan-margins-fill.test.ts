import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { up as fillPlanMargins } from '../../db/migrations/020-fill-plan-margins.ts';
import { startHarness, type Harness } from '../support/api-harness.ts';

let h: Harness;
beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
}, 60_000);
afterAll(() => h.close());

const bandsOf = () => sql<{ bands: number; units: number }>`select measure * 10 + band as bands, sum(units) as units from unit_exposure_bands group by 1 having sum(units) != 0 order by 1`.execute(h.db);

describe('plans saved before margins were kept', () => {
  it('get the bands the API gives them, and their units move into those bands', async () => {
    const margins = await h.db.selectFrom('planMargins').selectAll().orderBy('buildId').execute();
    expect(margins.length).toBeGreaterThan(100);
    const before = (await bandsOf()).rows;
    await h.db.deleteFrom('planMargins').execute();
    expect((await bandsOf()).rows).toEqual([]);

    await fillPlanMargins(h.db);
    expect(await h.db.selectFrom('planMargins').selectAll().orderBy('buildId').execute()).toEqual(margins);
    expect((await bandsOf()).rows).toEqual(before);
    // Filled once: a second run finds nothing left to fill and changes nothing.
    await fillPlanMargins(h.db);
    expect((await bandsOf()).rows).toEqual(before);
  });
});
