import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addCustomer } from '../support/catalog-fixtures.ts';
import { addPerson, addRole, SIGN_INS } from '../support/staff-fixtures.ts';

/**
 * A network accountant who also leads Asheville reads contact details at Asheville, where the
 * lead's role reads them, and nowhere else (field rules have union semantics, DEVELOPERS.md).
 */
describe('contact details of a person with two roles', () => {
  let h: Harness;
  let agent: Agent;
  let den: Awaited<ReturnType<typeof addCustomer>>;
  let avl: Awaited<ReturnType<typeof addCustomer>>;

  beforeAll(async () => {
    h = await startHarness();
    const ids = await demoIds(h.db);
    const person = await addPerson(h.db, { role: 'accountant' });
    await addRole(h.db, person.id, { role: 'location_lead', locationId: ids.location('AVL') });
    const { passwordHash } = await h.db.selectFrom('users').select('passwordHash').where('email', '=', SIGN_INS.lead2).executeTakeFirstOrThrow();
    await h.db.updateTable('users').set({ passwordHash }).where('id', '=', person.id).execute();
    agent = await h.signedIn(person.email);
    den = await addCustomer(h.db, ids.location('DEN'), { name: 'Greta Marrowfield', email: 'greta.marrowfield@mail.busbar.test' });
    avl = await addCustomer(h.db, ids.location('AVL'), { name: 'Hollis Marrowfield', email: 'hollis.marrowfield@mail.busbar.test' });
  });
  afterAll(() => h.close());

  it('reads them where one role allows it, in the list and in details', async () => {
    const list = await agent.get('/api/customers').query({ q: 'Marrowfield' });
    expect(list.body.items.map((c: Record<string, unknown>) => [c.name, c.email ?? 'hidden'])).toEqual([
      ['Greta Marrowfield', 'hidden'],
      ['Hollis Marrowfield', 'hollis.marrowfield@mail.busbar.test'],
    ]);
    const detail = await agent.get(`/api/customers/${den.id}`);
    expect(Object.keys(detail.body).sort()).toEqual(['id', 'locationId', 'name', 'vehicles', 'version']);
  });

  it('searches by e-mail only where it reads e-mail', async () => {
    const found = async (q: string) => (await agent.get('/api/customers').query({ q })).body.items.map((c: { id: number }) => c.id);
    expect(await found('greta.marrowfield@')).toEqual([]);
    expect(await found('hollis.marrowfield@')).toEqual([avl.id]);
  });

  it('answers a change at the shop it leads with the contact details, and refuses one elsewhere', async () => {
    const changed = await agent.put(`/api/customers/${avl.id}`).send({ name: avl.name, email: avl.email, phone: '828-555-0100', version: 1 });
    expect([changed.status, changed.body.phone, changed.body.email]).toEqual([200, '828-555-0100', avl.email]);
    const refused = await agent.put(`/api/customers/${den.id}`).send({ name: den.name, version: 1 });
    expect([refused.status, refused.body.error.code]).toEqual([403, 'forbidden']);
  });
});
