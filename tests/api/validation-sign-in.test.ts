import { DEMO_PASSWORD } from '@busbar/db';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { SIGN_INS, tokenOf } from '../support/staff-fixtures.ts';

const any = expect.any(String);
const BAD_LINK = 'This invite link is not valid';

describe('validation of sign-in and invite acceptance', () => {
  let h: Harness;
  let token: string;
  let inviteeId: number;

  beforeAll(async () => {
    h = await startHarness();
    const lead = await h.signedIn(SIGN_INS.lead);
    const email = 'pending.invitee@demo.busbar.test';
    const res = await lead.post('/api/staff/invites').send({ email, name: 'Pending Invitee', role: 'technician', locationId: (await demoIds(h.db)).location('DEN') });
    inviteeId = res.body.id;
    token = tokenOf((await h.lastMailTo(email)).link);
  });
  afterAll(() => h.close());

  const invalid = (fields: Record<string, unknown>) => ({ error: { code: 'invalid', message: 'Some fields need attention', fields } });
  const sessions = () => h.db.selectFrom('sessions').select('sid').execute();

  it.each([
    [{}, { email: any, password: any }],
    [{ email: SIGN_INS.lead, password: '' }, { password: 'Enter your password' }],
    [{ email: SIGN_INS.lead, password: 'p'.repeat(201) }, { password: any }],
    [{ email: SIGN_INS.lead, password: 12345678 }, { password: any }],
    [{ email: 'lead at demo', password: DEMO_PASSWORD }, { email: 'Enter a valid e-mail address' }],
    [{ email: SIGN_INS.lead, password: DEMO_PASSWORD, remember: true }, { remember: 'Unknown field' }],
  ])('rejects the sign-in %j and starts no session', async (body, fields) => {
    const before = await sessions();
    const res = await (await h.agent()).post('/api/session').send(body);
    expect(res.status).toBe(400);
    expect(res.body).toEqual(invalid(fields));
    expect(await sessions()).toEqual(before);
  });

  it('answers 400 to a body that is not JSON', async () => {
    const res = await (await h.agent()).post('/api/session').set('Content-Type', 'application/json').send('{"email":');
    expect(res.status).toBe(400);
    expect(res.body).toEqual({ error: { code: 'bad_request', message: 'The request could not be read' } });
  });

  it.each([
    ['a missing token and password', () => ({}), { token: any, password: any }],
    ['a short token', () => ({ token: 'abc', password: 'long-enough-password' }), { token: BAD_LINK }],
    ['a token with other characters', () => ({ token: `${token.slice(0, 42)}=`, password: 'long-enough-password' }), { token: BAD_LINK }],
    ['a password of 11 characters', () => ({ token, password: 'eleven-char' }), { password: 'Use at least 12 characters' }],
    ['a password of 201 characters', () => ({ token, password: 'p'.repeat(201) }), { password: 'Use at most 200 characters' }],
    ['an unknown field', () => ({ token, password: 'long-enough-password', email: 'someone@else.test' }), { email: 'Unknown field' }],
  ])('rejects an acceptance with %s and leaves the invite open', async (_label, body, fields) => {
    const res = await (await h.agent()).post('/api/invites/accept').send(body());
    expect(res.status).toBe(400);
    expect(res.body).toEqual(invalid(fields));
    const user = await h.db.selectFrom('users').select(['status', 'passwordHash']).where('id', '=', inviteeId).executeTakeFirstOrThrow();
    expect(user).toEqual({ status: 'invited', passwordHash: null });
    expect(await h.db.selectFrom('invites').select('usedAt').where('userId', '=', inviteeId).execute()).toEqual([{ usedAt: null }]);
  });

  it('rejects a malformed link when it is opened', async () => {
    const res = await (await h.agent()).get('/api/invites/not-a-token');
    expect(res.status).toBe(400);
    expect(res.body).toEqual(invalid({ token: BAD_LINK }));
  });

  it('still accepts the invite after all those refusals', async () => {
    const res = await (await h.agent()).post('/api/invites/accept').send({ token, password: 'long-enough-password' });
    expect(res.status).toBe(200);
    expect(res.body.person.id).toBe(inviteeId);
  });
});
