import { DEMO_PASSWORD } from '@busbar/db';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { addPerson, addRole, SIGN_INS, writtenRows } from '../support/staff-fixtures.ts';

const CANNOT_MANAGE = { error: { code: 'forbidden', message: "You cannot change this person's access" } };

describe('deactivating and reactivating people', () => {
  let h: Harness;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  beforeEach(async () => {
    h = await startHarness();
    ids = await demoIds(h.db);
  });
  afterEach(() => h.close());

  const statusOf = async (userId: number) =>
    (await h.db.selectFrom('users').select('status').where('id', '=', userId).executeTakeFirstOrThrow()).status;

  it('ends the open sessions of a deactivated person and lets them back in once reactivated', async () => {
    const lead = await h.signedIn(SIGN_INS.lead);
    const tech = await h.signedIn(SIGN_INS.tech);
    const techId = ids.user(SIGN_INS.tech);
    expect(await h.db.selectFrom('sessions').select('sid').where('userId', '=', techId).execute()).toHaveLength(1);

    const off = await lead.post(`/api/staff/${techId}/deactivate`);
    expect(off.status).toBe(200);
    expect(off.body).toMatchObject({ id: techId, status: 'inactive', canManage: true });
    expect(await statusOf(techId)).toBe('inactive');
    expect(await h.db.selectFrom('sessions').select('sid').where('userId', '=', techId).execute()).toEqual([]);
    const next = await tech.get('/api/session');
    expect(next.status).toBe(401);
    expect(next.body.error.code).toBe('unauthenticated');
    expect((await lead.get('/api/session')).status).toBe(200);

    const on = await lead.post(`/api/staff/${techId}/reactivate`);
    expect(on.status).toBe(200);
    expect(on.body.status).toBe('active');
    expect((await (await h.agent()).post('/api/session').send({ email: SIGN_INS.tech, password: DEMO_PASSWORD })).status).toBe(200);
  });

  it('returns someone who never set a password to invited on reactivation', async () => {
    const lead = await h.signedIn(SIGN_INS.lead);
    const person = await addPerson(h.db, { role: 'technician', locationId: ids.location('DEN') }, 'inactive');
    const res = await lead.post(`/api/staff/${person.id}/reactivate`);
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('invited');
    expect(await statusOf(person.id)).toBe('invited');
  });

  it('answers 409 to deactivating twice or reactivating someone active', async () => {
    const lead = await h.signedIn(SIGN_INS.lead);
    const person = await addPerson(h.db, { role: 'technician', locationId: ids.location('DEN') });
    expect((await lead.post(`/api/staff/${person.id}/reactivate`)).body).toEqual({ error: { code: 'conflict', message: 'This person is not deactivated' } });
    expect((await lead.post(`/api/staff/${person.id}/deactivate`)).status).toBe(200);
    const again = await lead.post(`/api/staff/${person.id}/deactivate`);
    expect(again.status).toBe(409);
    expect(again.body).toEqual({ error: { code: 'conflict', message: 'This person is already deactivated' } });
  });

  it('lets nobody deactivate themself', async () => {
    for (const email of [SIGN_INS.owner, SIGN_INS.lead, SIGN_INS.regional]) {
      const res = await (await h.signedIn(email)).post(`/api/staff/${ids.user(email)}/deactivate`);
      expect([email, res.status, res.body]).toEqual([email, 409, { error: { code: 'conflict', message: 'You cannot change your own access' } }]);
    }
    for (const email of [SIGN_INS.owner, SIGN_INS.lead, SIGN_INS.regional]) expect(await statusOf(ids.user(email))).toBe('active');
  });

  it('refuses a lead someone who also holds a role they cannot remove, elsewhere or above theirs', async () => {
    const lead = await h.signedIn(SIGN_INS.lead);
    const twoShops = await addPerson(h.db, { role: 'technician', locationId: ids.location('DEN') });
    await addRole(h.db, twoShops.id, { role: 'technician', locationId: ids.location('AVL') });
    const seen = await lead.get(`/api/staff/${twoShops.id}`);
    expect(seen.body.canManage).toBe(false);
    const otherLead = await addPerson(h.db, { role: 'location_lead', locationId: ids.location('DEN') });
    const before = await writtenRows(h.db);
    for (const target of [twoShops, otherLead]) {
      const res = await lead.post(`/api/staff/${target.id}/deactivate`);
      expect(res.status).toBe(403);
      expect(res.body).toEqual(CANNOT_MANAGE);
    }
    expect(await writtenRows(h.db)).toEqual(before);
    expect([await statusOf(twoShops.id), await statusOf(otherLead.id)]).toEqual(['active', 'active']);
  });

  it('lets a regional manager deactivate a location lead of the region but not a technician', async () => {
    const manager = await h.signedIn(SIGN_INS.regional);
    const lead = await addPerson(h.db, { role: 'location_lead', locationId: ids.location('PHX') });
    const tech = await addPerson(h.db, { role: 'technician', locationId: ids.location('PHX') });
    expect((await manager.post(`/api/staff/${lead.id}/deactivate`)).status).toBe(200);
    expect(await statusOf(lead.id)).toBe('inactive');
    const refused = await manager.post(`/api/staff/${tech.id}/deactivate`);
    expect(refused.status).toBe(403);
    expect(refused.body).toEqual(CANNOT_MANAGE);
    expect(await statusOf(tech.id)).toBe('active');
  });

  it('does not grant roles to a deactivated person', async () => {
    const lead = await h.signedIn(SIGN_INS.lead);
    const person = await addPerson(h.db, { role: 'technician', locationId: ids.location('DEN') }, 'inactive');
    const res = await lead.post(`/api/staff/${person.id}/roles`).send({ role: 'warranty_clerk', locationId: ids.location('DEN') });
    expect(res.status).toBe(409);
    expect(res.body).toEqual({ error: { code: 'conflict', message: 'This person is deactivated. Reactivate them first.' } });
  });
});
