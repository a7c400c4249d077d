import { REFILL_BUILD_COUNTS, type Db } from '@busbar/db';
import fc from 'fast-check';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { keptBuildCount } from '../../apps/api/src/queries/build-counts.ts';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { anyChange, apply, smallNetwork } from '../support/kept-changes.ts';
import { afterRefill, rolledBack } from '../support/kept-tables.ts';
import { signInEveryone, type SignIn } from '../support/staff-fixtures.ts';

let h: Harness;
let people: Record<SignIn, Agent>;
beforeAll(async () => {
  h = await startHarness();
  await smallNetwork(h.db);
  people = await signInEveryone(h);
});
afterAll(() => h.close());

/** The kept counts (migration 061) that are not zero, in key order. */
const keptCounts = async (db: Db) =>
  (await db.selectFrom('buildCounts').select(['locationId', 'status', 'builds']).where('builds', '<>', 0).orderBy('locationId').orderBy('status').execute());

/** The same counted straight from builds. */
const countedFromBuilds = async (db: Db) =>
  (await sql<{ locationId: number; status: string; builds: number }>`select location_id, status, count(*) as builds from builds group by 1, 2 order by 1, 2`.execute(db)).rows;

/** Every build a list holds, read page after page by its cursor, and the total its first page gave. */
async function readWhole(agent: Agent, query: string): Promise<{ total: number; totalCapped: boolean; listed: number }> {
  const first = await agent.get(`/api/builds?pageSize=4&${query}`).expect(200);
  let listed = first.body.items.length;
  for (let cursor = first.body.nextCursor; cursor; ) {
    const next = await agent.get(`/api/builds?pageSize=4&${query}&cursor=${cursor}`).expect(200);
    listed += next.body.items.length;
    cursor = next.body.nextCursor;
  }
  return { total: first.body.total, totalCapped: first.body.totalCapped, listed };
}

describe('the kept counts of builds', () => {
  it('match a refill from scratch and a count of the builds after any mix of changes', async () => {
    const change = await anyChange(h.db);
    expect(await keptCounts(h.db)).toEqual(await countedFromBuilds(h.db));
    await fc.assert(
      fc.asyncProperty(fc.array(change, { minLength: 1, maxLength: 15 }), async (changes) => {
        await rolledBack(h.db, async () => {
          for (const c of changes) await apply(h.db, c);
          const kept = await keptCounts(h.db);
          expect(kept).toEqual(await afterRefill(h.db, REFILL_BUILD_COUNTS, keptCounts));
          expect(kept).toEqual(await countedFromBuilds(h.db));
        });
      }),
      { seed: 10_061, numRuns: 100 },
    );
  }, 60_000);

  it('give every person’s list the number of builds it lists, and the lists narrowed further are counted from their rows alike', async () => {
    const ids = await demoIds(h.db);
    const den = ids.location('DEN');
    const region = (await h.db.selectFrom('locations').select('regionId').where('id', '=', den).executeTakeFirstOrThrow()).regionId;
    const queries = [
      '', 'status=delivered', 'status=booked&status=in_bay', `locationId=${den}`, `regionId=${region}`, `locationId=${den}&status=draft`,
      // Narrowed by more than shops and statuses: counted from the rows.
      'from=2025-12-25', 'deliveredFrom=2025-12-01&deliveredTo=2025-12-31', 'hasPlan=false', 'q=S-1',
    ];
    for (const who of ['owner', 'regional', 'lead', 'tech', 'lead2'] as const) {
      for (const query of queries) {
        const { total, totalCapped, listed } = await readWhole(people[who], query);
        expect({ who, query, total, totalCapped }).toEqual({ who, query, total: listed, totalCapped: false });
      }
    }
    const { listed: network } = await readWhole(people.owner, '');
    const { listed: shop } = await readWhole(people.lead, '');
    // The lead's shop is part of the network, not all of it.
    expect(shop).toBeGreaterThan(0);
    expect(network).toBeGreaterThan(shop);
  });

  it('stop at the cap and say there are more', async () => {
    const builds = Number((await sql<{ n: number }>`select count(*) as n from builds`.execute(h.db)).rows[0]!.n);
    expect(await keptBuildCount(h.db, 'all', [], builds)).toEqual({ total: builds, totalCapped: false });
    expect(await keptBuildCount(h.db, 'all', [], builds - 1)).toEqual({ total: builds - 1, totalCapped: true });
  });
});
