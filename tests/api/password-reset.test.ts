import { DEMO_PASSWORD } from '@busbar/db';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { addPerson, SIGN_INS, tokenOf } from '../support/staff-fixtures.ts';

const REQUESTED = { message: 'If that e-mail address has a Busbar account, a link to choose a new password is on its way. It works for an hour.' };
const USED = { error: { code: 'not_found', message: 'No such password reset: this link was already used or is not valid' } };
const NEW_PASSWORD = 'copper lugs and heat shrink';

describe('password reset by e-mail', () => {
  let h: Harness;
  beforeEach(async () => {
    h = await startHarness();
  });
  afterEach(() => h.close());

  const ask = async (email: string, address?: string) => {
    const agent = await h.agent();
    return address ? agent.post('/api/password-resets').set('X-Forwarded-For', address).send({ email }) : agent.post('/api/password-resets').send({ email });
  };
  const accept = async (token: string, password: string) => (await h.agent()).post('/api/password-resets/accept').send({ token, password });
  const signIn = async (email: string, password: string) => (await (await h.agent()).post('/api/session').send({ email, password })).status;
  /** The mail is sent after the answer: waits until `count` messages to `to` have arrived (and been logged). */
  async function mailsTo(to: string, count: number) {
    await expect.poll(async () => (await h.db.selectFrom('mailLog').select('id').where('toAddress', '=', to).execute()).length).toBe(count);
    return h.mail.messages.filter((m) => m.to.includes(to)).length;
  }

  it('mails a single-use link that sets a new password, ends every session and signs the person in', async () => {
    const ids = await demoIds(h.db);
    const before = await h.signedIn(SIGN_INS.tech);
    const res = await ask(SIGN_INS.tech);
    expect([res.status, res.body]).toEqual([202, REQUESTED]);
    expect(await mailsTo(SIGN_INS.tech, 1)).toBe(1);
    const mail = await h.lastMailTo(SIGN_INS.tech);
    expect(mail.subject).toBe('Choose a new Busbar password');
    expect(mail.text).toContain('expires in 60 minutes');
    expect(mail.link).toMatch(/^http:\/\/localhost:3000\/reset-password\?token=[A-Za-z0-9_-]{43}$/);
    const token = tokenOf(mail.link);
    const stored = await h.db.selectFrom('passwordResets').selectAll().execute();
    expect(stored).toEqual([expect.objectContaining({ userId: ids.user(SIGN_INS.tech), expiresAt: '2026-06-15T16:00:00.000Z', usedAt: null })]);
    expect(JSON.stringify(stored)).not.toContain(token);

    const opened = await (await h.agent()).get(`/api/password-resets/${token}`);
    expect(opened.body).toEqual({ email: SIGN_INS.tech, name: expect.any(String), expiresAt: '2026-06-15T16:00:00.000Z' });
    const weak = await accept(token, 'password1234');
    expect(weak.status).toBe(400);
    expect(weak.body.error.fields.password).toContain('too easy to guess');

    const agent = await h.agent();
    const done = await agent.post('/api/password-resets/accept').send({ token, password: NEW_PASSWORD });
    expect(done.status).toBe(200);
    expect(done.body.person.email).toBe(SIGN_INS.tech);
    expect((await agent.get('/api/session')).status).toBe(200);
    expect((await before.get('/api/session')).status).toBe(401);
    expect(await signIn(SIGN_INS.tech, DEMO_PASSWORD)).toBe(401);
    expect(await signIn(SIGN_INS.tech, NEW_PASSWORD)).toBe(200);
    const again = await accept(token, 'another fine long passphrase');
    expect([again.status, again.body]).toEqual([404, USED]);
    const audit = await h.db.selectFrom('auditLog').select(['action', 'actorId', 'entityId', 'after']).where('action', 'like', 'person.password_reset%').orderBy('id').execute();
    const from = { address: expect.stringMatching(/127\.0\.0\.1$/), userAgent: null };
    expect(audit.map((r) => ({ ...r, after: JSON.parse(r.after!) }))).toEqual([
      // The link, asked for by someone not signed in, then the reset by the person.
      { action: 'person.password_reset_link', actorId: null, entityId: ids.user(SIGN_INS.tech), after: from },
      { action: 'person.password_reset', actorId: ids.user(SIGN_INS.tech), entityId: ids.user(SIGN_INS.tech), after: { sessionsEnded: 1, ...from } },
    ]);
  });

  it('answers an unknown, an invited and a deactivated e-mail exactly as a known one, and mails none of them', async () => {
    const locationId = (await demoIds(h.db)).location('DEN');
    const invited = await addPerson(h.db, { role: 'technician', locationId }, 'invited');
    const inactive = await addPerson(h.db, { role: 'technician', locationId }, 'inactive');
    const answers = [];
    for (const email of ['nobody.here@demo.busbar.test', invited.email, inactive.email, SIGN_INS.lead]) {
      const res = await ask(email);
      answers.push({ status: res.status, body: res.body, type: res.headers['content-type'] });
    }
    expect(new Set(answers.map((a) => JSON.stringify(a))).size).toBe(1);
    expect(answers[0]).toEqual({ status: 202, body: REQUESTED, type: 'application/json; charset=utf-8' });
    await mailsTo(SIGN_INS.lead, 1);
    expect(h.mail.messages.map((m) => m.to)).toEqual([[SIGN_INS.lead]]);
    expect(await h.db.selectFrom('passwordResets').select('userId').execute()).toEqual([{ userId: (await demoIds(h.db)).user(SIGN_INS.lead) }]);
    // Only a link sent is audited: the audit log says nothing of the other addresses either.
    expect(await h.db.selectFrom('auditLog').select('entityId').where('action', '=', 'person.password_reset_link').execute()).toEqual([{ entityId: (await demoIds(h.db)).user(SIGN_INS.lead) }]);
  });

  it('refuses an expired link and a link of someone deactivated since', async () => {
    await ask(SIGN_INS.warranty);
    await mailsTo(SIGN_INS.warranty, 1);
    const token = tokenOf((await h.lastMailTo(SIGN_INS.warranty)).link);
    h.clock.now = new Date(h.clock.now.getTime() + 60 * 60_000);
    const late = await accept(token, NEW_PASSWORD);
    expect([late.status, late.body.error.code]).toEqual([410, 'reset_expired']);
    expect(await signIn(SIGN_INS.warranty, DEMO_PASSWORD)).toBe(200);

    await ask(SIGN_INS.accountant);
    await mailsTo(SIGN_INS.accountant, 1);
    await h.db.updateTable('users').set({ status: 'inactive' }).where('email', '=', SIGN_INS.accountant).execute();
    expect((await accept(tokenOf((await h.lastMailTo(SIGN_INS.accountant)).link), NEW_PASSWORD)).body).toEqual(USED);
  });

  it('mails an account at most three links an hour and refuses an address after twenty requests, saying nothing of accounts', async () => {
    for (let i = 0; i < 4; i++) expect((await ask(SIGN_INS.regional)).body).toEqual(REQUESTED);
    await mailsTo(SIGN_INS.regional, 3);
    for (let i = 0; i < 16; i++) expect((await ask(`nobody.${i}@demo.busbar.test`)).status).toBe(202);
    const refused = await ask(SIGN_INS.owner);
    expect([refused.status, refused.body.error.code, refused.headers['retry-after']]).toEqual([429, 'too_many_attempts', '3600']);
    expect(refused.body.error.message).toBe('Too many requests for a new password from here. Try again in 60 minutes.');
    expect((await ask('nobody.else@demo.busbar.test')).status).toBe(429);

    h.clock.now = new Date(h.clock.now.getTime() + 60 * 60_000);
    expect((await ask(SIGN_INS.regional)).status).toBe(202);
    await mailsTo(SIGN_INS.regional, 4);
  });

  it('never counts or mails for a malformed request', async () => {
    for (const body of [{}, { email: 'not an address' }, { email: SIGN_INS.lead, extra: 1 }]) {
      expect((await (await h.agent()).post('/api/password-resets').send(body)).status).toBe(400);
    }
    expect(await h.db.selectFrom('signInAttempts').select('id').execute()).toEqual([]);
    expect((await accept('short', NEW_PASSWORD)).body.error.fields).toEqual({ token: 'This reset link is not valid' });
  });
});
