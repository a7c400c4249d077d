import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { deliveredBuilds, type DeliveredBuild } from '../../apps/api/src/exports/records.ts';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';

let h: Harness;
beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
}, 60_000);
afterAll(() => h.close());

async function read(batches: AsyncIterable<DeliveredBuild[]>): Promise<{ sizes: number[]; keys: [string, number][] }> {
  const sizes: number[] = [];
  const keys: [string, number][] = [];
  for await (const batch of batches) {
    sizes.push(batch.length);
    keys.push(...batch.map((b) => [b.deliveredOn, b.id] as [string, number]));
  }
  return { sizes, keys };
}

/** The builds a plain query finds delivered in the days at the shops (null: all), by day and id. */
async function plainly(first: string, last: string, shops: number[] | null): Promise<[string, number][]> {
  let query = h.db.selectFrom('builds').select(['deliveredOn', 'id']).where('status', '=', 'delivered').where('deliveredOn', '>=', first).where('deliveredOn', '<=', last);
  if (shops) query = query.where('locationId', 'in', shops);
  const rows = await query.orderBy('deliveredOn').orderBy('id').execute();
  return rows.map((r) => [r.deliveredOn!, r.id]);
}

describe("an export's delivered builds, read a batch at a time", () => {
  it('holds every build delivered in the range once, by day and id, in batches of at most the size asked, for the network and for some shops', async () => {
    const ids = await demoIds(h.db);
    const shops = [ids.location('DEN'), ids.location('AUS')];
    for (const [scope, expected] of [
      ['all', await plainly('2026-03-01', '2026-05-31', null)],
      [shops, await plainly('2026-03-01', '2026-05-31', shops)],
    ] as const) {
      // Batches of 2 split the busier days into several batches, so reading on within a day is tried too.
      const { sizes, keys } = await read(deliveredBuilds({ db: h.db, first: '2026-03-01', last: '2026-05-31', scope: scope === 'all' ? 'all' : [...scope] }, 2));
      expect(expected.length).toBeGreaterThan(40);
      expect(keys).toEqual(expected);
      expect(Math.max(...sizes)).toBe(2);
      expect(sizes.every((size) => size > 0)).toBe(true);
      if (scope === 'all') expect(sizes.length).toBeGreaterThan(new Set(expected.map(([day]) => day)).size);
    }
  });

  it('reads nothing for a range without deliveries, or for no shops', async () => {
    expect((await read(deliveredBuilds({ db: h.db, first: '2030-01-01', last: '2030-01-31', scope: 'all' }))).keys).toEqual([]);
    expect((await read(deliveredBuilds({ db: h.db, first: '2026-03-01', last: '2026-05-31', scope: [] }))).keys).toEqual([]);
  });
});
