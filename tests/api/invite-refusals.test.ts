import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { freshEmail, SIGN_INS, tokenOf, writtenRows } from '../support/staff-fixtures.ts';

describe('invites that are refused', () => {
  let h: Harness;
  let denId: number;
  beforeEach(async () => {
    h = await startHarness();
    denId = (await demoIds(h.db)).location('DEN');
  });
  afterEach(() => h.close());

  it('answers 409 naming the e-mail when someone already has an account with it, in any case', async () => {
    const lead = await h.signedIn(SIGN_INS.lead);
    const before = await writtenRows(h.db);
    for (const email of [SIGN_INS.tech, 'TECH@Demo.Busbar.Test', SIGN_INS.lead2]) {
      const res = await lead.post('/api/staff/invites').send({ email, name: 'Someone Again', role: 'technician', locationId: denId });
      expect(res.status).toBe(409);
      expect(res.body).toEqual({
        error: {
          code: 'conflict',
          message: 'Someone with this e-mail already has an account: grant them the role instead',
          fields: { email: 'Already has an account' },
        },
      });
    }
    expect(await writtenRows(h.db)).toEqual(before);
    expect(h.mail.messages).toEqual([]);
  });

  it('answers 502 and writes no person, role, invite or audit entry when the mail server is down', async () => {
    await h.mail.close();
    const lead = await h.signedIn(SIGN_INS.lead);
    const before = await writtenRows(h.db);
    const email = freshEmail('unsent');
    const res = await lead.post('/api/staff/invites').send({ email, name: 'Not Yet Sent', role: 'technician', locationId: denId });
    expect(res.status).toBe(502);
    expect(res.body).toEqual({
      error: { code: 'mail_failed', message: 'The e-mail could not be sent, so nothing was changed. Try again later.' },
    });
    expect(await writtenRows(h.db)).toEqual({ ...before, mailLog: before.mailLog + 1 });
    expect(await h.db.selectFrom('users').select('id').where('email', '=', email).execute()).toEqual([]);
    // The outbox keeps the failed attempt, so the owner can see that mail is not going out.
    const attempt = await h.db.selectFrom('mailLog').select(['toAddress', 'status', 'error']).executeTakeFirstOrThrow();
    expect(attempt).toMatchObject({ toAddress: email, status: 'failed', error: expect.stringContaining('ECONNREFUSED') });
  });

  it('answers 502 to a resend when the mail server is down and keeps the old link working', async () => {
    const lead = await h.signedIn(SIGN_INS.lead);
    const email = freshEmail('resend');
    const invited = await lead.post('/api/staff/invites').send({ email, name: 'Resend Later', role: 'technician', locationId: denId });
    expect(invited.status).toBe(201);
    const first = tokenOf((await h.lastMailTo(email)).link);
    await h.mail.close();
    const before = await writtenRows(h.db);
    const res = await lead.post(`/api/staff/${invited.body.id}/invite`);
    expect(res.status).toBe(502);
    expect(await writtenRows(h.db)).toEqual({ ...before, mailLog: before.mailLog + 1 });
    expect((await (await h.agent()).get(`/api/invites/${first}`)).status).toBe(200);
  });

  it('sends a new link only to people who have not accepted yet', async () => {
    const lead = await h.signedIn(SIGN_INS.lead);
    const res = await lead.post(`/api/staff/${(await demoIds(h.db)).user(SIGN_INS.tech)}/invite`);
    expect(res.status).toBe(409);
    expect(res.body).toEqual({
      error: { code: 'conflict', message: 'Only people who have not yet accepted an invite can be sent a new one' },
    });
    expect(h.mail.messages).toEqual([]);
  });

  it('does not let an invite of someone deactivated while invited be accepted', async () => {
    const lead = await h.signedIn(SIGN_INS.lead);
    const email = freshEmail('dropped');
    const invited = await lead.post('/api/staff/invites').send({ email, name: 'Dropped Invite', role: 'technician', locationId: denId });
    const token = tokenOf((await h.lastMailTo(email)).link);
    expect((await lead.post(`/api/staff/${invited.body.id}/deactivate`)).status).toBe(200);
    const accepted = await (await h.agent()).post('/api/invites/accept').send({ token, password: 'a-long-enough-password' });
    expect(accepted.status).toBe(404);
    const user = await h.db.selectFrom('users').select(['status', 'passwordHash']).where('email', '=', email).executeTakeFirstOrThrow();
    expect(user).toEqual({ status: 'inactive', passwordHash: null });
    // Reactivated, the person is invited again, but the old link stays dead: they need a new one.
    expect((await lead.post(`/api/staff/${invited.body.id}/reactivate`)).body.status).toBe('invited');
    expect((await (await h.agent()).get(`/api/invites/${token}`)).status).toBe(404);
  });
});

describe('the mail log with real SMTP', () => {
  it('keeps the invite link out of the log while the person still gets it', async () => {
    const h = await startHarness({}, false);
    try {
      const lead = await h.signedIn(SIGN_INS.lead);
      const email = freshEmail('private');
      const denId = (await demoIds(h.db)).location('DEN');
      expect((await lead.post('/api/staff/invites').send({ email, name: 'Private Link', role: 'technician', locationId: denId })).status).toBe(201);
      const token = tokenOf((await h.lastMailTo(email)).link);
      const logged = await h.db.selectFrom('mailLog').select('text').where('toAddress', '=', email).executeTakeFirstOrThrow();
      expect(logged.text).not.toContain(token);
      expect(logged.text).toContain('/set-password?token=[removed from the log]');
    } finally {
      await h.close();
    }
  });
});
