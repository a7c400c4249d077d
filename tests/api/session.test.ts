import { scryptSync } from 'node:crypto';
import { DEMO_PASSWORD } from '@busbar/db';
import request from 'supertest';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

const REFUSED = 'That e-mail and password do not match an active account';

/** The Set-Cookie line of the session cookie a response sets, or undefined. */
function setSessionCookie(res: request.Response): string | undefined {
  return ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('busbar.sid='));
}

/** The `name=value` of the session cookie a response sets, or undefined. */
const sessionCookie = (res: request.Response) => setSessionCookie(res)?.split(';')[0];

describe('sign-in and sign-out', () => {
  let h: Harness;
  beforeEach(async () => {
    h = await startHarness();
  });
  afterEach(() => h.close());

  it("makes a password hash of an older cost again at today's cost when its person signs in", async () => {
    const salt = Buffer.from('older-cost-salt!');
    const old = ['scrypt', 10, 8, 1, salt.toString('base64url'), scryptSync(DEMO_PASSWORD, salt, 32, { N: 1024, r: 8, p: 1 }).toString('base64url')].join('$');
    await h.db.updateTable('users').set({ passwordHash: old }).where('email', '=', SIGN_INS.lead).execute();
    expect((await (await h.agent()).post('/api/session').send({ email: SIGN_INS.lead, password: DEMO_PASSWORD })).status).toBe(200);
    const { passwordHash } = await h.db.selectFrom('users').select('passwordHash').where('email', '=', SIGN_INS.lead).executeTakeFirstOrThrow();
    expect(passwordHash).not.toBe(old);
    expect(passwordHash!.split('$').slice(0, 4)).toEqual(['scrypt', '10', '8', '3']);
    expect((await (await h.agent()).post('/api/session').send({ email: SIGN_INS.lead, password: DEMO_PASSWORD })).status).toBe(200);
    expect((await (await h.agent()).post('/api/session').send({ email: SIGN_INS.lead, password: 'not the password' })).status).toBe(401);
  });

  it('signs a person in with their roles and rules and keeps them signed in', async () => {
    const ids = await demoIds(h.db);
    const agent = await h.agent();
    const res = await agent.post('/api/session').send({ email: SIGN_INS.lead, password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.person).toEqual({ id: ids.user(SIGN_INS.lead), email: SIGN_INS.lead, name: 'Priya Halvorsen', weeklyDigest: true });
    expect(res.body.assignments).toEqual([
      expect.objectContaining({ role: 'location_lead', scope: 'location', locationId: ids.location('DEN'), locationCode: 'DEN' }),
    ]);
    expect(res.body.rules).toContainEqual({ action: 'read', subject: 'Location', conditions: { id: { $in: [ids.location('DEN')] } } });
    // The server's date, which screens count months from: the harness's clock, not the test machine's.
    expect(res.body.today).toBe('2026-06-15');
    const cookie = setSessionCookie(res);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);

    const again = await agent.get('/api/session');
    expect(again.status).toBe(200);
    expect(again.body).toEqual(res.body);
    const user = await h.db.selectFrom('users').select('lastSignInAt').where('email', '=', SIGN_INS.lead).executeTakeFirstOrThrow();
    expect(user.lastSignInAt).toBe('2026-06-15T15:00:00.000Z');
  });

  it('takes the e-mail in any case and with spaces around it', async () => {
    const res = await (await h.agent()).post('/api/session').send({ email: '  Lead@Demo.Busbar.TEST ', password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.person.email).toBe(SIGN_INS.lead);
  });

  it('signs out: the session ends and the next request answers 401', async () => {
    const agent = await h.signedIn(SIGN_INS.tech);
    const out = await agent.delete('/api/session');
    expect(out.status).toBe(204);
    expect(await h.db.selectFrom('sessions').selectAll().execute()).toEqual([]);
    const after = await agent.get('/api/session');
    expect(after.status).toBe(401);
    expect(after.body).toEqual({ error: { code: 'unauthenticated', message: 'Please sign in' } });
  });

  it('answers a wrong password and an unknown e-mail with the same 401, and starts no session', async () => {
    const wrong = await (await h.agent()).post('/api/session').send({ email: SIGN_INS.lead, password: 'not-the-password' });
    const unknown = await (await h.agent()).post('/api/session').send({ email: 'nobody@demo.busbar.test', password: DEMO_PASSWORD });
    for (const res of [wrong, unknown]) {
      expect(res.status).toBe(401);
      expect(res.body).toEqual({ error: { code: 'invalid_credentials', message: REFUSED } });
      expect(sessionCookie(res)).toBeUndefined();
    }
    expect(await h.db.selectFrom('sessions').selectAll().execute()).toEqual([]);
  });

  it('refuses a deactivated person with the same answer as a wrong password', async () => {
    const lead = await h.signedIn(SIGN_INS.lead);
    const ids = await demoIds(h.db);
    expect((await lead.post(`/api/staff/${ids.user(SIGN_INS.tech)}/deactivate`)).status).toBe(200);
    const res = await (await h.agent()).post('/api/session').send({ email: SIGN_INS.tech, password: DEMO_PASSWORD });
    expect(res.status).toBe(401);
    expect(res.body).toEqual({ error: { code: 'invalid_credentials', message: REFUSED } });
  });

  it('refuses an invited person who has not set a password yet', async () => {
    await h.db.updateTable('users').set({ status: 'invited', passwordHash: null }).where('email', '=', SIGN_INS.warranty).execute();
    const res = await (await h.agent()).post('/api/session').send({ email: SIGN_INS.warranty, password: DEMO_PASSWORD });
    expect(res.status).toBe(401);
    expect(res.body.error.message).toBe(REFUSED);
  });

  it('gives a new session id at every sign-in and ends the old one', async () => {
    const agent = await h.agent();
    const first = sessionCookie(await agent.post('/api/session').send({ email: SIGN_INS.tech, password: DEMO_PASSWORD }));
    const second = sessionCookie(await agent.post('/api/session').send({ email: SIGN_INS.lead, password: DEMO_PASSWORD }));
    expect(first).toMatch(/^busbar\.sid=s%3A/);
    expect(second).toMatch(/^busbar\.sid=s%3A/);
    expect(second).not.toBe(first);
    expect(await h.db.selectFrom('sessions').select('userId').execute()).toEqual([{ userId: (await demoIds(h.db)).user(SIGN_INS.lead) }]);

    const replayed = await request(h.app).get('/api/session').set('Cookie', first!);
    expect(replayed.status).toBe(401);
    const current = await request(h.app).get('/api/session').set('Cookie', second!);
    expect(current.status).toBe(200);
    expect(current.body.person.email).toBe(SIGN_INS.lead);
  });

  it('ends a session 12 hours after its last request', async () => {
    const agent = await h.signedIn(SIGN_INS.tech);
    h.clock.now = new Date('2026-06-16T02:00:00Z');
    expect((await agent.get('/api/session')).status).toBe(200);
    h.clock.now = new Date('2026-06-16T13:59:00Z');
    expect((await agent.get('/api/session')).status).toBe(200);
    h.clock.now = new Date('2026-06-17T02:00:00Z');
    const expired = await agent.get('/api/session');
    expect(expired.status).toBe(401);
    expect(expired.body.error.code).toBe('unauthenticated');
  });

  it('answers 401 to a request without a session', async () => {
    const res = await request(h.app).get('/api/session');
    expect(res.status).toBe(401);
    expect(res.body).toEqual({ error: { code: 'unauthenticated', message: 'Please sign in' } });
  });
});
