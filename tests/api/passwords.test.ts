import { DEMO_PASSWORD } from '@busbar/db';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { SIGN_INS, tokenOf } from '../support/staff-fixtures.ts';

const COMMON = 'This password is too easy to guess. This is similar to a commonly used password. Add more words that are less common.';
const PERSONAL = 'Leave your name and e-mail address out of your password.';
const refused = (field: string, message: string) => ({ error: { code: 'invalid', message, fields: { [field]: message } } });

describe('the password rule', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startHarness();
  });
  afterAll(() => h.close());

  it.each([
    ['a common password', 'password1234', COMMON],
    ['a keyboard row', 'qwertyuiop12', COMMON],
    ['repeated characters', 'aaaaaaaaaaaaaaaa', 'This password is too easy to guess. Repeated characters like "aaa" are easy to guess. Add more words that are less common. Avoid repeated words and characters.'],
    ['the person\'s name', 'brightwater-rocks-42', PERSONAL],
    ['the person\'s e-mail', 'my NELL.SPARKS pass', PERSONAL],
  ])('refuses %s when an invite is accepted, and leaves the invite open', async (_label, password, message) => {
    const email = `nell.sparks.${Math.random().toString(36).slice(2, 8)}@example.test`;
    const lead = await h.signedIn(SIGN_INS.lead);
    const invited = await lead.post('/api/staff/invites').send({ email, name: 'Nell Brightwater', role: 'technician', locationId: (await demoIds(h.db)).location('DEN') });
    const token = tokenOf((await h.lastMailTo(email)).link);
    const res = await (await h.agent()).post('/api/invites/accept').send({ token, password });
    expect([res.status, res.body]).toEqual([400, refused('password', message)]);
    expect(await h.db.selectFrom('users').select(['status', 'passwordHash']).where('id', '=', invited.body.id).executeTakeFirstOrThrow()).toEqual({ status: 'invited', passwordHash: null });
    expect((await (await h.agent()).post('/api/invites/accept').send({ token, password: 'copper lugs and heat shrink' })).status).toBe(200);
  });
});

describe('changing one\'s own password', () => {
  let h: Harness;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  beforeAll(async () => {
    h = await startHarness();
    ids = await demoIds(h.db);
  });
  afterAll(() => h.close());

  const change = (agent: Agent, currentPassword: string, newPassword: string) => agent.post('/api/session/password').send({ currentPassword, newPassword });
  const signIn = async (email: string, password: string) => (await (await h.agent()).post('/api/session').send({ email, password })).status;

  it('asks for a session', async () => {
    const res = await change(await h.agent(), DEMO_PASSWORD, 'copper lugs and heat shrink');
    expect(res.status).toBe(401);
  });

  it('refuses a weak or personal new password, and the current one again, and changes nothing', async () => {
    const tech = await h.signedIn(SIGN_INS.tech);
    const { name } = await h.db.selectFrom('users').select('name').where('email', '=', SIGN_INS.tech).executeTakeFirstOrThrow();
    const surname = name.split(' ').at(-1)!.toLowerCase();
    expect((await change(tech, DEMO_PASSWORD, 'password1234')).body).toEqual(refused('newPassword', COMMON));
    expect((await change(tech, DEMO_PASSWORD, `${surname} wires the van`)).body).toEqual(refused('newPassword', PERSONAL));
    expect((await change(tech, DEMO_PASSWORD, DEMO_PASSWORD)).body).toEqual(refused('newPassword', 'Choose a password other than your current one'));
    expect((await change(tech, DEMO_PASSWORD, 'short')).status).toBe(400);
    expect(await signIn(SIGN_INS.tech, DEMO_PASSWORD)).toBe(200);
  });

  it('changes the password, ends the person\'s other sessions, keeps this one, and audits it', async () => {
    const phone = await h.signedIn(SIGN_INS.lead2);
    const desk = await h.signedIn(SIGN_INS.lead2);
    const other = await h.signedIn(SIGN_INS.regional);
    const res = await change(desk, DEMO_PASSWORD, 'copper lugs and heat shrink').set('User-Agent', 'desk browser');
    expect(res.status).toBe(204);
    expect((await desk.get('/api/session')).status).toBe(200);
    expect((await phone.get('/api/session')).status).toBe(401);
    expect((await other.get('/api/session')).status).toBe(200);
    expect(await signIn(SIGN_INS.lead2, DEMO_PASSWORD)).toBe(401);
    expect(await signIn(SIGN_INS.lead2, 'copper lugs and heat shrink')).toBe(200);
    const audit = await h.db.selectFrom('auditLog').select(['actorId', 'entityId', 'after']).where('action', '=', 'person.password_change').execute();
    const lead2 = ids.user(SIGN_INS.lead2);
    expect(audit.map((r) => ({ ...r, after: JSON.parse(r.after!) }))).toEqual([
      { actorId: lead2, entityId: lead2, after: { sessionsEnded: 1, address: expect.stringMatching(/127\.0\.0\.1$/), userAgent: 'desk browser' } },
    ]);
  });

  it('counts a wrong current password as a failed sign-in, and locks the address after ten', async () => {
    const warranty = await h.signedIn(SIGN_INS.warranty);
    const wrong = await change(warranty, 'not my password', 'copper lugs and heat shrink');
    expect([wrong.status, wrong.body]).toEqual([400, refused('currentPassword', 'That is not your current password')]);
    const failed = await h.db.selectFrom('auditLog').select(['actorId', 'after']).where('action', '=', 'session.sign_in_failed').where('entityId', '=', ids.user(SIGN_INS.warranty)).execute();
    expect(failed.map((r) => [r.actorId, JSON.parse(r.after!).during])).toEqual([[ids.user(SIGN_INS.warranty), 'password_change']]);
    // A malformed request does not count.
    expect((await warranty.post('/api/session/password').send({ currentPassword: 'not my password' })).status).toBe(400);
    for (let i = 0; i < 9; i++) expect((await change(warranty, `guess ${i}`, 'copper lugs and heat shrink')).status).toBe(400);
    const locked = await change(warranty, DEMO_PASSWORD, 'copper lugs and heat shrink');
    expect(locked.status).toBe(429);
    expect(await signIn(SIGN_INS.warranty, DEMO_PASSWORD)).toBe(429);
  });
});
