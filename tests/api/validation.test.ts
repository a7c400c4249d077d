import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { SIGN_INS, writtenRows } from '../support/staff-fixtures.ts';

const any = expect.any(String);
const SCOPE = 'This role cannot be held at that scope';

describe('validation of staff requests', () => {
  let h: Harness;
  let lead: Agent;
  let owner: Agent;
  let den: number;
  let techId: number;
  let before: Awaited<ReturnType<typeof writtenRows>>;

  beforeAll(async () => {
    h = await startHarness();
    lead = await h.signedIn(SIGN_INS.lead);
    owner = await h.signedIn(SIGN_INS.owner);
    const ids = await demoIds(h.db);
    den = ids.location('DEN');
    techId = ids.user(SIGN_INS.tech);
  });
  beforeEach(async () => {
    before = await writtenRows(h.db);
  });
  afterAll(() => h.close());

  /** A 400 naming exactly these fields, after which nothing was written or sent. */
  async function expectInvalid(res: { status: number; body: unknown }, fields: Record<string, unknown>) {
    expect(res.status).toBe(400);
    expect(res.body).toEqual({ error: { code: 'invalid', message: 'Some fields need attention', fields } });
    expect(await writtenRows(h.db)).toEqual(before);
    expect(h.mail.messages).toEqual([]);
  }

  const invite = (body: Record<string, unknown>) => lead.post('/api/staff/invites').send(body);
  const valid = () => ({ email: 'new.tech@demo.busbar.test', name: 'New Tech', role: 'technician', locationId: den });

  it('names every missing field of an invite', async () => {
    await expectInvalid(await invite({}), { email: any, name: any, role: 'Choose a role' });
  });

  it.each([
    ['email', 'not-an-address', 'Enter a valid e-mail address'],
    ['email', `${'a'.repeat(250)}@x.test`, any],
    ['email', 42, any],
    ['name', '', 'Enter a name'],
    ['name', '   ', 'Enter a name'],
    ['name', 'n'.repeat(121), any],
    ['role', 'boss', 'Choose a role'],
    ['role', null, 'Choose a role'],
    ['locationId', 0, any],
    ['locationId', -3, any],
    ['locationId', 1.5, any],
    ['locationId', 'DEN', any],
  ])('rejects an invite whose %s is %j', async (field, value, message) => {
    await expectInvalid(await invite({ ...valid(), [field]: value }), { [field]: message });
  });

  it.each([
    ['a technician at a region', 'regionId', { role: 'technician', locationId: undefined, regionId: 1 }],
    ['a technician nowhere', 'locationId', { role: 'technician', locationId: undefined }, 'Choose a location'],
    ['a technician at a location and a region', 'locationId', { role: 'technician', regionId: 1 }],
    ['a regional manager at a location', 'locationId', { role: 'regional_manager' }],
    ['a regional manager nowhere', 'regionId', { role: 'regional_manager', locationId: undefined }, 'Choose a region'],
    ['an owner at a region', 'regionId', { role: 'owner', locationId: undefined, regionId: 1 }],
  ] as [string, string, Record<string, unknown>, string?][])('rejects an invite of %s, naming %s', async (_label, field, change, message = SCOPE) => {
    await expectInvalid(await invite({ ...valid(), ...change }), { [field]: message });
  });

  it('rejects unknown fields of an invite by name', async () => {
    await expectInvalid(await invite({ ...valid(), status: 'active', passwordHash: 'x' }), { status: 'Unknown field', passwordHash: 'Unknown field' });
  });

  it('validates a role grant: its fields, unknown fields and the person id', async () => {
    const grant = (id: unknown, body: Record<string, unknown>) => lead.post(`/api/staff/${String(id)}/roles`).send(body);
    await expectInvalid(await grant(techId, {}), { role: 'Choose a role' });
    await expectInvalid(await grant(techId, { role: 'warranty_clerk', locationId: 'here' }), { locationId: any });
    await expectInvalid(await grant(techId, { role: 'warranty_clerk', locationId: den, userId: 1 }), { userId: 'Unknown field' });
    await expectInvalid(await grant(techId, { role: 'warranty_clerk' }), { locationId: 'Choose a location' });
    await expectInvalid(await grant('someone', { role: 'warranty_clerk', locationId: den }), { id: any });
    await expectInvalid(await grant(0, { role: 'warranty_clerk', locationId: den }), { id: any });
  });

  it('validates the ids in the paths of the other staff routes', async () => {
    await expectInvalid(await lead.delete(`/api/staff/${techId}/roles/first`), { assignmentId: any });
    await expectInvalid(await lead.delete('/api/staff/x/roles/1'), { id: any });
    await expectInvalid(await lead.post('/api/staff/-1/deactivate'), { id: any });
    await expectInvalid(await lead.post('/api/staff/1.5/reactivate'), { id: any });
    await expectInvalid(await lead.post('/api/staff/me/invite'), { id: any });
    await expectInvalid(await lead.get('/api/staff/everyone'), { id: any });
  });

  it('takes an id written in decimal digits only, in paths, queries and bodies alike', async () => {
    const words = 'Use an id: a whole number above 0';
    // Each of these a plain number coercion reads as an id of a record (16, 7, 2713, 2713, 7).
    for (const id of ['0x10', '0o7', '+2713', '2.713e3', '007', ' 7', '7.0', '99999999999999999']) {
      await expectInvalid(await owner.get(`/api/staff/${encodeURIComponent(id)}`), { id: words });
      await expectInvalid(await owner.get('/api/staff').query({ locationId: id }), { locationId: words });
    }
    await expectInvalid(await owner.post('/api/staff/invites').send({ ...valid(), locationId: '0x1' }), { locationId: words });
    await expectInvalid(await owner.post('/api/staff/invites').send({ ...valid(), locationId: 1.5 }), { locationId: words });
    expect((await owner.get(`/api/staff/${techId}`)).status).toBe(200);
    expect((await owner.get('/api/staff').query({ locationId: String(den) })).status).toBe(200);
  });

  it.each([
    [{ pageSize: 0 }, 'pageSize'],
    [{ pageSize: 201 }, 'pageSize'],
    [{ page: 0 }, 'page'],
    [{ status: 'retired' }, 'status'],
    [{ locationId: 'DEN' }, 'locationId'],
    [{ q: 'q'.repeat(101) }, 'q'],
  ])('rejects the staff list query %j, naming %s', async (query, field) => {
    await expectInvalid(await lead.get('/api/staff').query(query), { [field]: any });
  });

  it('rejects unknown query fields of the staff list, the audit log and the outbox', async () => {
    await expectInvalid(await lead.get('/api/staff').query({ sort: 'name' }), { sort: 'Unknown field' });
    await expectInvalid(await owner.get('/api/audit').query({ actor: 3 }), { actor: 'Unknown field' });
    await expectInvalid(await owner.get('/api/outbox').query({ status: 'failed' }), { status: 'Unknown field' });
    await expectInvalid(await owner.get('/api/audit').query({ pageSize: 500 }), { pageSize: any });
  });
});
