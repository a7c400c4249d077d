import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { SIGN_INS, signInEveryone, type SignIn } from '../support/staff-fixtures.ts';

let h: Harness;
let agents: Record<SignIn, Agent>;
let ids: Awaited<ReturnType<typeof demoIds>>;

beforeAll(async () => {
  h = await startHarness();
  ids = await demoIds(h.db);
  agents = await signInEveryone(h);
});
afterAll(() => h.close());

type Person = { id: number; name: string };

/** The people who lead builds at these locations, by a plain read of every role assignment. */
async function scanned(locationIds: number[]): Promise<Person[]> {
  const rows = await h.db
    .selectFrom('users as u')
    .innerJoin('roleAssignments as ra', 'ra.userId', 'u.id')
    .select(['u.id', 'u.name', 'u.status', 'ra.role', 'ra.locationId'])
    .execute();
  const leads = rows.filter((r) => r.status === 'active' && ['technician', 'location_lead'].includes(r.role) && locationIds.includes(r.locationId ?? 0));
  const people = new Map(leads.map((r) => [r.id, { id: r.id, name: r.name }]));
  return [...people.values()].sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : a.id - b.id));
}

/** The locations whose builds each person reads (builds-access.test.ts). */
const readable = (who: SignIn): number[] => {
  const den = ids.location('DEN');
  const region = ids.locations.find((l) => l.id === den)!.regionId;
  if (who === 'owner' || who === 'accountant') return ids.locations.map((l) => l.id);
  if (who === 'regional') return ids.locations.filter((l) => l.regionId === region).map((l) => l.id);
  return who === 'lead2' ? [ids.location('AVL')] : [den];
};

const listed = async (who: SignIn, query = '') => (await agents[who].get(`/api/locations/technicians?pageSize=200${query}`)).body;

describe('the people who lead builds at the shops a person reads', () => {
  it.each(Object.keys(SIGN_INS) as SignIn[])('are for %s exactly those of a plain scan, and no one of another shop', async (who) => {
    const answer = await listed(who);
    const expected = await scanned(readable(who));
    expect(answer.items).toEqual(expected);
    expect(answer).toMatchObject({ total: expected.length, totalCapped: false, page: 1, pageSize: 200 });
    expect(expected.length).toBeGreaterThan(0);
  });

  it('keep to the shop or region asked for, and refuse one outside the person’s shops', async () => {
    const avl = ids.location('AVL');
    const owners = await listed('owner', `&locationId=${avl}`);
    expect(owners.items).toEqual(await scanned([avl]));
    const otherRegion = ids.locations.find((l) => l.id === avl)!.regionId;
    expect((await listed('owner', `&regionId=${otherRegion}`)).items).toEqual(await scanned(ids.locations.filter((l) => l.regionId === otherRegion).map((l) => l.id)));
    for (const query of [`&locationId=${avl}`, `&regionId=${otherRegion}`]) {
      const refused = await agents.lead.get(`/api/locations/technicians?${query.slice(1)}`);
      expect([refused.status, refused.body.error.message]).toEqual([403, 'You cannot read the builds of that shop or region']);
    }
  });

  it('find by a part of the name in any case, taking % and _ literally', async () => {
    const all = await scanned(readable('owner'));
    const part = all[0]!.name.split(' ').at(-1)!.slice(1, 4).toUpperCase();
    const found = await listed('owner', `&q=${encodeURIComponent(part)}`);
    expect(found.items).toEqual(all.filter((p) => p.name.toLowerCase().includes(part.toLowerCase())));
    expect(found.items.length).toBeGreaterThan(0);
    expect((await listed('owner', '&q=%25')).items).toEqual([]);
    expect((await listed('owner', '&q=_')).items).toEqual([]);
  });

  it('name one person by id, only when they lead builds at the person’s shops', async () => {
    const atDenver = new Set((await scanned(readable('lead'))).map((p) => p.id));
    const elsewhere = (await scanned([ids.location('AVL')])).find((p) => !atDenver.has(p.id))!;
    expect((await listed('owner', `&id=${elsewhere.id}`)).items).toEqual([elsewhere]);
    expect((await listed('lead', `&id=${elsewhere.id}`)).items).toEqual([]);
    expect((await listed('owner', `&id=${ids.user(SIGN_INS.accountant)}`)).items).toEqual([]);
  });

  it('leave out people no longer active, and page by name', async () => {
    const [first, second] = await scanned(readable('lead'));
    await h.db.updateTable('users').set({ status: 'inactive' }).where('id', '=', first!.id).execute();
    try {
      const page = (await agents.lead.get('/api/locations/technicians?pageSize=1&page=1')).body;
      expect(page.items).toEqual([second]);
      expect(page.total).toBe((await scanned(readable('lead'))).length);
    } finally {
      await h.db.updateTable('users').set({ status: 'active' }).where('id', '=', first!.id).execute();
    }
  });
});
