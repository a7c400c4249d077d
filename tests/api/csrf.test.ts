import { once } from 'node:events';
import type { AddressInfo } from 'node:net';
import { DEMO_PASSWORD } from '@busbar/db';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { freshEmail, SIGN_INS, writtenRows } from '../support/staff-fixtures.ts';

const FORGED = { error: { code: 'csrf', message: 'This request did not come from a Busbar page. Reload the page and try again.' } };

const cookiePair = (res: request.Response, name: string) =>
  ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith(`${name}=`))!.split(';')[0]!;

/** A browser's cookies after signing in on a Busbar page, and the token that page would echo. */
async function browserOf(h: Harness, email: string): Promise<{ cookie: string; token: string }> {
  const csrf = cookiePair(await request(h.app).get('/api/health'), 'busbar.csrf');
  const token = decodeURIComponent(csrf.split('=')[1]!);
  const res = await request(h.app).post('/api/session').set('Cookie', csrf).set('x-csrf-token', token).send({ email, password: DEMO_PASSWORD });
  expect(res.status).toBe(200);
  // Signing in hands out a new token, bound to the new session.
  const signedInCsrf = cookiePair(res, 'busbar.csrf');
  expect(signedInCsrf).not.toBe(csrf);
  return { cookie: `${signedInCsrf}; ${cookiePair(res, 'busbar.sid')}`, token: decodeURIComponent(signedInCsrf.split('=')[1]!) };
}

describe('forged cross-site requests', () => {
  let h: Harness;
  let lead: { cookie: string; token: string };
  let owner: { cookie: string; token: string };
  let invite: { email: string; name: string; role: 'technician'; locationId: number };

  beforeAll(async () => {
    h = await startHarness();
    lead = await browserOf(h, SIGN_INS.lead);
    owner = await browserOf(h, SIGN_INS.owner);
    invite = { email: freshEmail('forged'), name: 'Forged Invite', role: 'technician', locationId: (await demoIds(h.db)).location('DEN') };
  });
  afterAll(() => h.close());

  const post = (path: string) => request(h.app).post(path).set('Cookie', lead.cookie);

  const forgeries: [string, () => Record<string, string>][] = [
    ['no token header', () => ({})],
    ['a made-up token header', () => ({ 'x-csrf-token': 'made-up' })],
    ['the token of another browser', () => ({ 'x-csrf-token': owner.token })],
    ['the right token sent from another site (Origin)', () => ({ 'x-csrf-token': lead.token, Origin: 'https://evil.example' })],
    ['the right token sent from another site (Referer)', () => ({ 'x-csrf-token': lead.token, Referer: 'https://evil.example/page' })],
    ['the right token from a cross-site fetch', () => ({ 'x-csrf-token': lead.token, 'Sec-Fetch-Site': 'cross-site' })],
    ['the right token from an opaque origin', () => ({ 'x-csrf-token': lead.token, Origin: 'null' })],
  ];

  it.each(forgeries)('rejects an invite with %s and writes nothing', async (_label, headers) => {
    const before = await writtenRows(h.db);
    const res = await post('/api/staff/invites').set(headers()).send(invite);
    expect(res.status).toBe(403);
    expect(res.body).toEqual(FORGED);
    expect(await writtenRows(h.db)).toEqual(before);
    expect(await h.db.selectFrom('users').select('id').where('email', '=', invite.email).execute()).toEqual([]);
    expect(h.mail.messages.filter((m) => m.to.includes(invite.email))).toEqual([]);
  });

  it('rejects a token whose signature was not made by the server, even in both cookie and header', async () => {
    const made = 'attacker-nonce.attacker-signature';
    const sid = lead.cookie.split('; ')[1]!;
    const res = await request(h.app)
      .post(`/api/staff/${(await demoIds(h.db)).user(SIGN_INS.tech)}/deactivate`)
      .set('Cookie', `busbar.csrf=${made}; ${sid}`)
      .set('x-csrf-token', made);
    expect(res.status).toBe(403);
    expect(res.body).toEqual(FORGED);
    const tech = await h.db.selectFrom('users').select('status').where('email', '=', SIGN_INS.tech).executeTakeFirstOrThrow();
    expect(tech.status).toBe('active');
  });

  it("rejects another session's token even sent in both cookie and header, so a planted pair cannot be used against someone", async () => {
    const sid = lead.cookie.split('; ')[1]!;
    const ownerPair = owner.cookie.split('; ')[0]!;
    const res = await request(h.app).post('/api/staff/invites').set('Cookie', `${ownerPair}; ${sid}`).set('x-csrf-token', owner.token).send(invite);
    expect(res.status).toBe(403);
    expect(res.body).toEqual(FORGED);
    expect(await h.db.selectFrom('users').select('id').where('email', '=', invite.email).execute()).toEqual([]);
    // The refusal hands the browser a token of its own session, which then works.
    const fresh = cookiePair(res, 'busbar.csrf');
    const retried = await request(h.app).patch('/api/session').set('Cookie', `${fresh}; ${sid}`).set('x-csrf-token', decodeURIComponent(fresh.split('=')[1]!)).send({ weeklyDigest: true });
    expect(retried.status).toBe(200);
  });

  it('rejects a token made before sign-in once someone is signed in', async () => {
    const anonymous = cookiePair(await request(h.app).get('/api/health'), 'busbar.csrf');
    const token = decodeURIComponent(anonymous.split('=')[1]!);
    const sid = lead.cookie.split('; ')[1]!;
    const res = await request(h.app).post('/api/staff/invites').set('Cookie', `${anonymous}; ${sid}`).set('x-csrf-token', token).send(invite);
    expect(res.status).toBe(403);
    expect(res.body).toEqual(FORGED);
  });

  it("hands out a new token at sign-out, and refuses the ended session's token afterwards", async () => {
    const browser = await browserOf(h, SIGN_INS.tech);
    const out = await request(h.app).delete('/api/session').set('Cookie', browser.cookie).set('x-csrf-token', browser.token);
    expect(out.status).toBe(204);
    const after = cookiePair(out, 'busbar.csrf');
    expect(after).not.toBe(browser.cookie.split('; ')[0]);
    const stale = browser.cookie.split('; ')[0]!;
    const refused = await request(h.app).post('/api/session').set('Cookie', stale).set('x-csrf-token', browser.token).send({ email: SIGN_INS.tech, password: DEMO_PASSWORD });
    expect(refused.status).toBe(403);
    const again = await request(h.app).post('/api/session').set('Cookie', after).set('x-csrf-token', decodeURIComponent(after.split('=')[1]!)).send({ email: SIGN_INS.tech, password: DEMO_PASSWORD });
    expect(again.status).toBe(200);
  });

  it('rejects a forged sign-out: the session keeps working', async () => {
    const res = await request(h.app).delete('/api/session').set('Cookie', lead.cookie).set('Origin', 'https://evil.example').set('x-csrf-token', lead.token);
    expect(res.status).toBe(403);
    expect(res.body).toEqual(FORGED);
    expect((await request(h.app).get('/api/session').set('Cookie', lead.cookie)).status).toBe(200);
  });

  it('rejects a forged sign-in from a page without the token, and starts no session', async () => {
    const sessions = await h.db.selectFrom('sessions').select('sid').execute();
    const res = await request(h.app).post('/api/session').send({ email: SIGN_INS.owner, password: DEMO_PASSWORD });
    expect(res.status).toBe(403);
    expect(res.body).toEqual(FORGED);
    expect(await h.db.selectFrom('sessions').select('sid').execute()).toEqual(sessions);
  });

  it('accepts the same request from a Busbar page, so the rejections above are about forgery', async () => {
    const server = h.app.listen(0, '127.0.0.1');
    await once(server, 'listening');
    const { port } = server.address() as AddressInfo;
    const res = await request(server)
      .post('/api/staff/invites')
      .set('Cookie', lead.cookie)
      .set('x-csrf-token', lead.token)
      .set('Origin', `http://127.0.0.1:${port}`)
      .send(invite);
    server.close();
    expect(res.status).toBe(201);
    const written = await h.db.selectFrom('users').select('status').where('email', '=', invite.email).execute();
    expect(written).toEqual([{ status: 'invited' }]);
  });
});
