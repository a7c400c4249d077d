import { buildQuery, customerQuery, serialQuery } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { LocationScope } from '../../apps/api/src/access/locations.ts';
import { listBuilds } from '../../apps/api/src/queries/builds.ts';
import { listCustomers } from '../../apps/api/src/queries/customers.ts';
import { findSerials } from '../../apps/api/src/queries/serials.ts';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';

/**
 * Lists and searches take a different road for a scope of a few locations (the full-text
 * index's place markers, the location index) than for a large one (the matches or the names
 * walked in order, other locations' rows dropped). Both roads must find the same rows: a scope
 * padded with ids of locations that do not exist reads as the shop alone, and the network's
 * every location named one by one reads as the whole network.
 */
let h: Harness;
let den: number;
let every: number[];
/** A piece of the surname of one of the shop's customers. */
let surname: string;

beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
  den = (await demoIds(h.db)).location('DEN');
  every = (await h.db.selectFrom('locations').select('id').execute()).map((l) => l.id);
  const customer = await h.db.selectFrom('customers').select('name').where('locationId', '=', den).orderBy('id').limit(1).offset(3).executeTakeFirstOrThrow();
  surname = customer.name.split(' ').at(-1)!.slice(0, 5);
}, 60_000);
afterAll(() => h.close());

/** DEN and twenty locations that do not exist: a large scope with one real shop in it. */
const padded = () => [den, ...Array.from({ length: 20 }, (_, i) => 100_000 + i)];

const ids = (page: { items: { id: number }[] }) => page.items.map((r) => r.id);

async function customers(scope: LocationScope, q?: string) {
  const page = await listCustomers(h.db, { ...customerQuery.parse({ q, pageSize: 200 }), scope, emailScope: scope, phoneScope: scope });
  return { ids: ids(page), total: page.total };
}

describe('a large scope reads what a small one does', () => {
  it('finds the same builds for the shop alone and for the shop among many locations', async () => {
    for (const q of [surname, 'DEN-00', 'an', undefined]) {
      for (const status of [undefined, 'delivered']) {
        const query = buildQuery.parse({ q, status, pageSize: 200 });
        const alone = await listBuilds(h.db, [den], query);
        expect(alone.items.length, `${q} ${status}`).toBeGreaterThan(0);
        expect(ids(await listBuilds(h.db, padded(), query)), `${q} ${status}`).toEqual(ids(alone));
      }
    }
  });

  it('finds the same customers for the shop alone and for the shop among many locations', async () => {
    for (const q of [surname, 'ar', undefined]) {
      const alone = await customers([den], q);
      expect(alone.ids.length, q).toBeGreaterThan(0);
      expect(await customers(padded(), q), q).toEqual(alone);
    }
  });

  it('pages the whole network by name the same when every location is named as when none is', async () => {
    const named = await customers(every);
    expect(named.total).toBeGreaterThan(2_000);
    expect(named).toEqual(await customers('all'));
    for (const page of [1, 3]) {
      const query = customerQuery.parse({ q: 'e', page, pageSize: 100 });
      const all = await listCustomers(h.db, { ...query, scope: 'all', emailScope: 'all', phoneScope: 'all' });
      expect(ids(await listCustomers(h.db, { ...query, scope: every, emailScope: every, phoneScope: every }))).toEqual(ids(all));
    }
  });

  it('finds the same serial numbers for the shop alone and for the shop among many locations', async () => {
    const unit = await h.db
      .selectFrom('buildItems as i')
      .innerJoin('builds as b', 'b.id', 'i.buildId')
      .select('i.serialNumber')
      .where('b.locationId', '=', den)
      .where('i.serialNumber', 'is not', null)
      .orderBy('i.id')
      .limit(1)
      .executeTakeFirstOrThrow();
    const query = serialQuery.parse({ q: unit.serialNumber!.slice(0, 4), pageSize: 100 });
    const alone = await findSerials(h.db, [den], query);
    expect(alone.items.length).toBeGreaterThan(0);
    expect(await findSerials(h.db, padded(), query)).toEqual(alone);
  });
});
