import type { StaffPerson } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addPerson, addRole, SIGN_INS } from '../support/staff-fixtures.ts';

type Listed = StaffPerson;

describe('staff list', () => {
  let h: Harness;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  let lead: Agent;
  let twoShops: { id: number; assignmentId: number; email: string };
  let avlRoleId: number;

  beforeAll(async () => {
    h = await startHarness();
    ids = await demoIds(h.db);
    lead = await h.signedIn(SIGN_INS.lead);
    twoShops = await addPerson(h.db, { role: 'technician', locationId: ids.location('DEN') });
    avlRoleId = await addRole(h.db, twoShops.id, { role: 'warranty_clerk', locationId: ids.location('AVL') });
  });
  afterAll(() => h.close());

  const everyone = async (agent: Agent, query: Record<string, string | number> = {}): Promise<Listed[]> => {
    const res = await agent.get('/api/staff').query({ pageSize: 200, ...query });
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(res.body.items.length);
    return res.body.items;
  };

  /** Ids of the people holding any role at one of the locations. */
  const staffOf = async (codes: string[]) => {
    const rows = await h.db
      .selectFrom('roleAssignments')
      .select('userId')
      .distinct()
      .where('locationId', 'in', codes.map((c) => ids.location(c)))
      .execute();
    return rows.map((r) => r.userId).sort((a, b) => a - b);
  };
  const idsOf = (people: Listed[]) => people.map((p) => p.id).sort((a, b) => a - b);

  it("gives a lead exactly the people of their location, with that location's roles only", async () => {
    const people = await everyone(lead);
    expect(idsOf(people)).toEqual(await staffOf(['DEN']));
    for (const person of people) {
      expect(person.assignments.length).toBeGreaterThan(0);
      expect(person.assignments.every((a) => a.locationId === ids.location('DEN'))).toBe(true);
    }
  });

  it('never shows a lead the roles someone holds at another location, in any answer', async () => {
    const answers = [
      await lead.get('/api/staff').query({ q: twoShops.email }),
      await lead.get(`/api/staff/${twoShops.id}`),
      await lead.post(`/api/staff/${twoShops.id}/roles`).send({ role: 'warranty_clerk', locationId: ids.location('DEN') }),
    ];
    const granted = answers[2]!.body.assignments.find((a: { role: string }) => a.role === 'warranty_clerk');
    answers.push(await lead.delete(`/api/staff/${twoShops.id}/roles/${granted.id}`));
    for (const res of answers) {
      expect(res.status).toBeLessThan(300);
      expect(JSON.stringify(res.body)).not.toMatch(/AVL|Asheville/);
      for (const person of (res.body.items ?? [res.body]) as Listed[]) {
        expect(person.assignments.map((a) => a.id)).not.toContain(avlRoleId);
        expect(person.assignments.map((a) => a.locationId)).not.toContain(ids.location('AVL'));
      }
    }
    expect(answers[1]!.body.assignments).toEqual([expect.objectContaining({ id: twoShops.assignmentId, locationCode: 'DEN' })]);
    expect(answers[1]!.body.canManage).toBe(false);
  });

  it("gives a regional manager the people of their region's locations and themself, nobody from the other region", async () => {
    const people = await everyone(await h.signedIn(SIGN_INS.regional));
    const self = ids.user(SIGN_INS.regional);
    expect(idsOf(people)).toEqual([...(await staffOf(['DEN', 'BOI', 'PDX', 'PHX'])), self].sort((a, b) => a - b));
    const west = ['DEN', 'BOI', 'PDX', 'PHX'].map((c) => ids.location(c));
    for (const person of people.filter((p) => p.id !== self)) {
      expect(person.assignments.every((a) => west.includes(a.locationId!))).toBe(true);
    }
    const own = people.find((p) => p.id === self)!;
    expect(own.assignments.map((a) => [a.role, a.regionId])).toEqual([['regional_manager', ids.region('WEST')]]);
    expect(own.canManage).toBe(false);
  });

  it('gives the owner everyone, and filters by location, status and text', async () => {
    const owner = await h.signedIn(SIGN_INS.owner);
    const all = await everyone(owner);
    const users = await h.db.selectFrom('users').select('id').execute();
    expect(idsOf(all)).toEqual(users.map((u) => u.id).sort((a, b) => a - b));
    expect(all.map((p) => p.name)).toEqual(all.map((p) => p.name).sort((a, b) => (a < b ? -1 : a > b ? 1 : 0)));

    expect(idsOf(await everyone(owner, { locationId: ids.location('AVL') }))).toEqual(await staffOf(['AVL']));
    const invited = await addPerson(h.db, { role: 'technician', locationId: ids.location('BOI') }, 'invited');
    expect(idsOf(await everyone(owner, { status: 'invited' }))).toEqual([invited.id]);
    expect((await everyone(owner, { q: 'HALVORSEN' })).map((p) => p.email)).toEqual([SIGN_INS.lead]);
  });

  it('finds an e-mail with an underscore by its text and treats % and _ as plain characters', async () => {
    const owner = await h.signedIn(SIGN_INS.owner);
    const person = await addPerson(h.db, { role: 'technician', locationId: ids.location('PHX') });
    await h.db.updateTable('users').set({ email: 'ivy_ross@demo.busbar.test' }).where('id', '=', person.id).execute();
    expect(idsOf(await everyone(owner, { q: 'ivy_ross' }))).toEqual([person.id]);
    expect(await everyone(owner, { q: 'y_r' })).toHaveLength(1);
    expect(await everyone(owner, { q: '%' })).toEqual([]);
    expect(await everyone(owner, { q: 'lead_demo' })).toEqual([]);
  });

  it('pages through the list', async () => {
    const owner = await h.signedIn(SIGN_INS.owner);
    const all = await everyone(owner);
    const page = await owner.get('/api/staff').query({ page: 3, pageSize: 4 });
    expect(page.body).toMatchObject({ total: all.length, page: 3, pageSize: 4 });
    expect(page.body.items.map((p: Listed) => p.id)).toEqual(all.slice(8, 12).map((p) => p.id));
  });

  it("pages a lead's and a regional manager's list in full pages, with the total of what they see", async () => {
    for (const agent of [lead, await h.signedIn(SIGN_INS.regional)]) {
      const all = await everyone(agent);
      expect(all.length).toBeGreaterThan(3);
      const seen: number[] = [];
      for (let page = 1; seen.length < all.length; page++) {
        const res = await agent.get('/api/staff').query({ page, pageSize: 3 });
        expect(res.body.total).toBe(all.length);
        expect(res.body.items.length).toBe(Math.min(3, all.length - seen.length));
        seen.push(...res.body.items.map((p: Listed) => p.id));
      }
      expect(seen).toEqual(all.map((p) => p.id));
    }
  });
});
