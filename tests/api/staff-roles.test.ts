import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { addPerson, SIGN_INS, writtenRows } from '../support/staff-fixtures.ts';

const CANNOT_GRANT = { error: { code: 'forbidden', message: 'You cannot grant this role at this scope' } };
const notFound = (what: string) => ({ error: { code: 'not_found', message: `No such ${what}` } });
const expectNotFound = (res: { status: number; body: unknown }, what: string) => {
  expect(res.status).toBe(404);
  expect(res.body).toEqual(notFound(what));
};

describe('granting and removing roles', () => {
  let h: Harness;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  beforeEach(async () => {
    h = await startHarness();
    ids = await demoIds(h.db);
  });
  afterEach(() => h.close());

  const rolesOf = (userId: number) =>
    h.db.selectFrom('roleAssignments').select(['role', 'locationId', 'regionId', 'createdBy']).where('userId', '=', userId).orderBy('id').execute();

  it('lets a lead grant technician and warranty clerk at their own location', async () => {
    const lead = await h.signedIn(SIGN_INS.lead);
    const person = await addPerson(h.db, { role: 'technician', locationId: ids.location('DEN') });
    const res = await lead.post(`/api/staff/${person.id}/roles`).send({ role: 'warranty_clerk', locationId: ids.location('DEN') });
    expect(res.status).toBe(201);
    expect(res.body.assignments.map((a: { role: string }) => a.role)).toEqual(['technician', 'warranty_clerk']);
    expect(await rolesOf(person.id)).toEqual([
      { role: 'technician', locationId: ids.location('DEN'), regionId: null, createdBy: null },
      { role: 'warranty_clerk', locationId: ids.location('DEN'), regionId: null, createdBy: ids.user(SIGN_INS.lead) },
    ]);
  });

  it('refuses a lead any role at or above their own (403), and a region they cannot see (404)', async () => {
    const lead = await h.signedIn(SIGN_INS.lead);
    const person = await addPerson(h.db, { role: 'technician', locationId: ids.location('DEN') });
    const before = await writtenRows(h.db);
    for (const body of [{ role: 'location_lead', locationId: ids.location('DEN') }, { role: 'owner' }, { role: 'accountant' }]) {
      const res = await lead.post(`/api/staff/${person.id}/roles`).send(body);
      expect(res.status).toBe(403);
      expect(res.body).toEqual(CANNOT_GRANT);
    }
    expectNotFound(await lead.post(`/api/staff/${person.id}/roles`).send({ role: 'regional_manager', regionId: ids.region('WEST') }), 'region');
    expect(await writtenRows(h.db)).toEqual(before);
  });

  it('hides another location from a lead: its people, its roles and the location itself answer 404', async () => {
    const lead = await h.signedIn(SIGN_INS.lead);
    const avl = await addPerson(h.db, { role: 'technician', locationId: ids.location('AVL') });
    const den = await addPerson(h.db, { role: 'technician', locationId: ids.location('DEN') });
    const before = await writtenRows(h.db);
    const answers = [
      await lead.get(`/api/staff/${avl.id}`),
      await lead.post(`/api/staff/${avl.id}/roles`).send({ role: 'warranty_clerk', locationId: ids.location('AVL') }),
      await lead.delete(`/api/staff/${avl.id}/roles/${avl.assignmentId}`),
      await lead.post(`/api/staff/${avl.id}/deactivate`),
    ];
    for (const res of answers) expectNotFound(res, 'person');
    expectNotFound(await lead.post(`/api/staff/${den.id}/roles`).send({ role: 'technician', locationId: ids.location('AVL') }), 'location');
    expectNotFound(await lead.delete(`/api/staff/${den.id}/roles/${avl.assignmentId}`), 'role assignment');
    expect(await writtenRows(h.db)).toEqual(before);
  });

  it('lets a regional manager appoint location leads in their region only', async () => {
    const manager = await h.signedIn(SIGN_INS.regional);
    const person = await addPerson(h.db, { role: 'technician', locationId: ids.location('DEN') });
    const granted = await manager.post(`/api/staff/${person.id}/roles`).send({ role: 'location_lead', locationId: ids.location('BOI') });
    expect(granted.status).toBe(201);
    expect(granted.body.assignments).toContainEqual(expect.objectContaining({ role: 'location_lead', locationCode: 'BOI' }));

    expectNotFound(await manager.post(`/api/staff/${person.id}/roles`).send({ role: 'location_lead', locationId: ids.location('AUS') }), 'location');
    const technician = await manager.post(`/api/staff/${person.id}/roles`).send({ role: 'technician', locationId: ids.location('PDX') });
    expect(technician.status).toBe(403);
    expect(technician.body).toEqual(CANNOT_GRANT);
    const removeTechnician = await manager.delete(`/api/staff/${person.id}/roles/${person.assignmentId}`);
    expect(removeTechnician.status).toBe(403);
    expect(removeTechnician.body).toEqual({ error: { code: 'forbidden', message: 'You cannot remove this role' } });

    const leadRole = granted.body.assignments.find((a: { role: string }) => a.role === 'location_lead');
    expect((await manager.delete(`/api/staff/${person.id}/roles/${leadRole.id}`)).status).toBe(200);
    expect((await rolesOf(person.id)).map((r) => r.role)).toEqual(['technician']);
  });

  it('lets the owner appoint a regional manager, whose next request sees the new region', async () => {
    const owner = await h.signedIn(SIGN_INS.owner);
    const lead2 = await h.signedIn(SIGN_INS.lead2);
    const before = await lead2.get('/api/staff').query({ locationId: ids.location('AUS') });
    expect(before.body.total).toBe(0);
    const res = await owner.post(`/api/staff/${ids.user(SIGN_INS.lead2)}/roles`).send({ role: 'regional_manager', regionId: ids.region('EAST') });
    expect(res.status).toBe(201);
    expect(res.body.assignments).toContainEqual(expect.objectContaining({ role: 'regional_manager', scope: 'region', regionId: ids.region('EAST') }));
    const after = await lead2.get('/api/staff').query({ locationId: ids.location('AUS') });
    expect(after.body.total).toBeGreaterThan(0);
  });

  it('answers 409 naming the role when the person already holds it there', async () => {
    const lead = await h.signedIn(SIGN_INS.lead);
    const res = await lead.post(`/api/staff/${ids.user(SIGN_INS.tech)}/roles`).send({ role: 'technician', locationId: ids.location('DEN') });
    expect(res.status).toBe(409);
    expect(res.body).toEqual({ error: { code: 'conflict', message: 'This person already holds that role there', fields: { role: 'Already held' } } });
  });

  it('answers with the person after removing the last role the lead could see, who is then out of sight', async () => {
    const lead = await h.signedIn(SIGN_INS.lead);
    const person = await addPerson(h.db, { role: 'technician', locationId: ids.location('DEN') });
    const res = await lead.delete(`/api/staff/${person.id}/roles/${person.assignmentId}`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: person.id, email: person.email, assignments: [], canManage: false });
    expect(await rolesOf(person.id)).toEqual([]);
    expect((await lead.get(`/api/staff/${person.id}`)).status).toBe(404);
  });

  it('keeps the last owner: the only owner cannot give up the role, one of two can', async () => {
    const owner = await h.signedIn(SIGN_INS.owner);
    const ownerId = ids.user(SIGN_INS.owner);
    const own = (await owner.get(`/api/staff/${ownerId}`)).body.assignments[0];
    const refused = await owner.delete(`/api/staff/${ownerId}/roles/${own.id}`);
    expect(refused.status).toBe(409);
    expect(refused.body).toEqual({ error: { code: 'conflict', message: 'The network must keep at least one owner' } });
    expect((await rolesOf(ownerId)).map((r) => r.role)).toEqual(['owner']);

    const second = await addPerson(h.db, { role: 'owner' });
    expect((await owner.delete(`/api/staff/${ownerId}/roles/${own.id}`)).status).toBe(200);
    expect(await rolesOf(ownerId)).toEqual([]);
    expect((await rolesOf(second.id)).map((r) => r.role)).toEqual(['owner']);
  });

  it('does not count an owner who is deactivated', async () => {
    const owner = await h.signedIn(SIGN_INS.owner);
    await addPerson(h.db, { role: 'owner' }, 'inactive');
    const own = (await owner.get(`/api/staff/${ids.user(SIGN_INS.owner)}`)).body.assignments[0];
    expect((await owner.delete(`/api/staff/${ids.user(SIGN_INS.owner)}/roles/${own.id}`)).status).toBe(409);
  });
});
