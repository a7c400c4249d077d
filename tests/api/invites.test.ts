import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { freshEmail, SIGN_INS, tokenOf } from '../support/staff-fixtures.ts';

const USED = { error: { code: 'not_found', message: 'No such invite: this link was already used or is not valid' } };
const EXPIRED = { error: { code: 'invite_expired', message: 'This invite link has expired. Ask for a new one.' } };

describe('invites', () => {
  let h: Harness;
  let email: string;
  beforeEach(async () => {
    h = await startHarness();
    email = freshEmail('invitee');
  });
  afterEach(() => h.close());

  /** The lead of Denver invites a technician; answers the new person's id and the e-mailed token. */
  async function leadInvites(): Promise<{ id: number; token: string }> {
    const lead = await h.signedIn(SIGN_INS.lead);
    const res = await lead.post('/api/staff/invites').send({ email, name: 'Nell Brightwater', role: 'technician', locationId: (await demoIds(h.db)).location('DEN') });
    expect(res.status).toBe(201);
    return { id: res.body.id, token: tokenOf((await h.lastMailTo(email)).link) };
  }

  const accept = async (token: string, password: string) => (await h.agent()).post('/api/invites/accept').send({ token, password });

  it('takes an invited technician from the e-mailed link to signed in, and later to signing in again', async () => {
    const ids = await demoIds(h.db);
    const lead = await h.signedIn(SIGN_INS.lead);
    const invited = await lead.post('/api/staff/invites').send({ email, name: 'Nell Brightwater', role: 'technician', locationId: ids.location('DEN') });
    expect(invited.status).toBe(201);
    expect(invited.body).toMatchObject({ email, name: 'Nell Brightwater', status: 'invited', lastSignInAt: null, canManage: true });
    expect(invited.body.assignments).toEqual([expect.objectContaining({ role: 'technician', scope: 'location', locationId: ids.location('DEN') })]);

    const mail = await h.lastMailTo(email);
    expect(mail.subject).toBe('Your Busbar invitation');
    expect(mail.text).toContain('Hello Nell Brightwater,');
    expect(mail.text).toContain('Priya Halvorsen has invited you to Busbar as technician.');
    expect(mail.link).toMatch(/^http:\/\/localhost:3000\/set-password\?token=[A-Za-z0-9_-]{43}$/);
    expect(h.mail.messages.at(-1)).toMatchObject({ from: 'no-reply@busbar.test', to: [email] });
    const token = tokenOf(mail.link);

    const stored = await h.db.selectFrom('invites').selectAll().where('userId', '=', invited.body.id).execute();
    expect(stored).toEqual([expect.objectContaining({ expiresAt: '2026-06-18T15:00:00.000Z', usedAt: null, createdBy: ids.user(SIGN_INS.lead) })]);
    expect(JSON.stringify(stored)).not.toContain(token);

    const opened = await (await h.agent()).get(`/api/invites/${token}`);
    expect(opened.status).toBe(200);
    expect(opened.body).toEqual({ email, name: 'Nell Brightwater', expiresAt: '2026-06-18T15:00:00.000Z' });

    h.clock.now = new Date('2026-06-16T09:30:00Z');
    const newcomer = await h.agent();
    const accepted = await newcomer.post('/api/invites/accept').send({ token, password: 'amp-hours-all-day' });
    expect(accepted.status).toBe(200);
    expect(accepted.body.person).toEqual({ id: invited.body.id, email, name: 'Nell Brightwater', weeklyDigest: true });
    const session = await newcomer.get('/api/session');
    expect(session.status).toBe(200);
    expect(session.body.assignments).toEqual([expect.objectContaining({ role: 'technician', locationId: ids.location('DEN') })]);
    const user = await h.db.selectFrom('users').select(['status', 'lastSignInAt']).where('email', '=', email).executeTakeFirstOrThrow();
    expect(user).toEqual({ status: 'active', lastSignInAt: '2026-06-16T09:30:00.000Z' });

    expect((await newcomer.delete('/api/session')).status).toBe(204);
    const later = await (await h.agent()).post('/api/session').send({ email, password: 'amp-hours-all-day' });
    expect(later.status).toBe(200);
    expect(later.body.person.email).toBe(email);
  });

  it('lets a link be used once', async () => {
    const { token } = await leadInvites();
    expect((await accept(token, 'first-password-chosen')).status).toBe(200);
    const again = await accept(token, 'second-password-tried');
    expect(again.status).toBe(404);
    expect(again.body).toEqual(USED);
    const opened = await (await h.agent()).get(`/api/invites/${token}`);
    expect(opened.status).toBe(404);
    expect(opened.body).toEqual(USED);
    expect((await (await h.agent()).post('/api/session').send({ email, password: 'second-password-tried' })).status).toBe(401);
    expect((await (await h.agent()).post('/api/session').send({ email, password: 'first-password-chosen' })).status).toBe(200);
  });

  it('lets only one of two requests racing with the same link set the password', async () => {
    const { id, token } = await leadInvites();
    const passwords = ['racing-password-one', 'racing-password-two'];
    const answers = await Promise.all(passwords.map((password) => accept(token, password)));
    expect(answers.map((r) => r.status).sort()).toEqual([200, 404]);
    const audit = await h.db.selectFrom('auditLog').select('action').where('entityId', '=', id).where('action', '=', 'person.accept_invite').execute();
    expect(audit).toHaveLength(1);
    const winner = answers.findIndex((r) => r.status === 200);
    const signIns = await Promise.all(passwords.map(async (password) => (await (await h.agent()).post('/api/session').send({ email, password })).status));
    expect(signIns).toEqual(passwords.map((_, i) => (i === winner ? 200 : 401)));
  });

  it('answers 410 to a link past its 72 hours, and leaves the person invited', async () => {
    const { token } = await leadInvites();
    h.clock.now = new Date('2026-06-18T14:59:00Z');
    expect((await (await h.agent()).get(`/api/invites/${token}`)).status).toBe(200);
    h.clock.now = new Date('2026-06-18T15:00:00Z');
    const opened = await (await h.agent()).get(`/api/invites/${token}`);
    expect(opened.status).toBe(410);
    expect(opened.body).toEqual(EXPIRED);
    const accepted = await accept(token, 'too-late-password');
    expect(accepted.status).toBe(410);
    expect(accepted.body).toEqual(EXPIRED);
    const user = await h.db.selectFrom('users').select(['status', 'passwordHash']).where('email', '=', email).executeTakeFirstOrThrow();
    expect(user).toEqual({ status: 'invited', passwordHash: null });
  });

  it('sends a new link on request that replaces the old one, with a fresh 72 hours', async () => {
    const { id, token: first } = await leadInvites();
    h.clock.now = new Date('2026-06-20T08:00:00Z');
    const lead = await h.signedIn(SIGN_INS.lead);
    const resent = await lead.post(`/api/staff/${id}/invite`);
    expect(resent.status).toBe(204);
    expect(h.mail.messages.filter((m) => m.to.includes(email))).toHaveLength(2);
    const second = tokenOf((await h.lastMailTo(email)).link);
    expect(second).not.toBe(first);

    const old = await (await h.agent()).get(`/api/invites/${first}`);
    expect(old.status).toBe(404);
    expect(old.body).toEqual(USED);
    const fresh = await (await h.agent()).get(`/api/invites/${second}`);
    expect(fresh.status).toBe(200);
    expect(fresh.body.expiresAt).toBe('2026-06-23T08:00:00.000Z');
    expect((await accept(second, 'second-link-password')).status).toBe(200);
  });

  it('answers 404 to a well-formed link that was never sent', async () => {
    const res = await (await h.agent()).get(`/api/invites/${'A'.repeat(43)}`);
    expect(res.status).toBe(404);
    expect(res.body).toEqual(USED);
  });
});
