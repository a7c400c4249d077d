import type { ClaimDetail } from '@busbar/shared';
import { simpleParser } from 'mailparser';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { startMailCapture } from '../../apps/api/src/mail/capture.ts';
import { countMail, newInviteLimits, reinviteLimits, vendorRequestLimits } from '../../apps/api/src/mail/limits.ts';
import { createMailer } from '../../apps/api/src/mail/mailer.ts';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addDeliveredUnit, SMALL_PNG, uploadEvidence } from '../support/claim-fixtures.ts';
import { addPerson, freshEmail, SIGN_INS } from '../support/staff-fixtures.ts';

let h: Harness;
beforeEach(async () => {
  h = await startHarness();
});
afterEach(() => h.close());

const later = (minutes: number) => {
  h.clock.now = new Date(h.clock.now.getTime() + minutes * 60_000);
};
const mailsTo = (email: string) => h.mail.messages.filter((m) => m.to.includes(email)).length;

describe('re-invites', () => {
  it('sends one person at most 3 new links an hour, then says when to try again', async () => {
    const lead = await h.signedIn(SIGN_INS.lead);
    const person = await addPerson(h.db, { role: 'technician', locationId: (await demoIds(h.db)).location('DEN') }, 'invited');
    for (let i = 0; i < 3; i++) {
      expect((await lead.post(`/api/staff/${person.id}/invite`)).status).toBe(204);
      later(10);
    }
    const refused = await lead.post(`/api/staff/${person.id}/invite`);
    expect(refused.status).toBe(429);
    expect(refused.body.error).toEqual({ code: 'too_many_mails', message: 'This person has already been sent 3 invites in the last hour. Try again in 30 minutes.' });
    expect(mailsTo(person.email)).toBe(3);
    expect(await h.db.selectFrom('auditLog').select('id').where('action', '=', 'person.reinvite').where('entityId', '=', person.id).execute()).toHaveLength(3);
    // Someone else asking changes nothing: the limit is the invited person's.
    expect((await (await h.signedIn(SIGN_INS.owner)).post(`/api/staff/${person.id}/invite`)).status).toBe(429);
    later(30);
    expect((await lead.post(`/api/staff/${person.id}/invite`)).status).toBe(204);
    expect(mailsTo(person.email)).toBe(4);
  });

  it('lets one sender re-invite at most 20 times an hour, whoever they re-invite', async () => {
    const lead = await h.signedIn(SIGN_INS.lead);
    const leadId = (await demoIds(h.db)).user(SIGN_INS.lead);
    for (let other = 1; other <= 20; other++) await countMail(h.db, reinviteLimits(100_000 + other, leadId), h.clock.now);
    const person = await addPerson(h.db, { role: 'technician', locationId: (await demoIds(h.db)).location('DEN') }, 'invited');
    const refused = await lead.post(`/api/staff/${person.id}/invite`);
    expect(refused.status).toBe(429);
    expect(refused.body.error.message).toBe('You have already sent 20 invites again in the last hour. Try again in 60 minutes.');
    expect(mailsTo(person.email)).toBe(0);
    expect((await (await h.signedIn(SIGN_INS.owner)).post(`/api/staff/${person.id}/invite`)).status).toBe(204);
  });
});

describe('new invites', () => {
  it('lets one sender invite at most 50 new people an hour, writing no person when refused', async () => {
    const lead = await h.signedIn(SIGN_INS.lead);
    const den = (await demoIds(h.db)).location('DEN');
    const invite = (email: string) => lead.post('/api/staff/invites').send({ email, name: 'Quillon Tarrant', role: 'technician', locationId: den });
    const first = freshEmail('new-hire');
    expect((await invite(first)).status).toBe(201);
    const leadId = (await demoIds(h.db)).user(SIGN_INS.lead);
    for (let other = 2; other <= 50; other++) await countMail(h.db, newInviteLimits(leadId), h.clock.now);
    const email = freshEmail('new-hire');
    const refused = await invite(email);
    expect(refused.status).toBe(429);
    expect(refused.body.error).toEqual({ code: 'too_many_mails', message: 'You have already invited 50 new people in the last hour. Try again in 60 minutes.' });
    expect(mailsTo(email)).toBe(0);
    expect(await h.db.selectFrom('users').select('id').where('email', '=', email).execute()).toEqual([]);
    // The limit is the sender's: the owner still invites.
    expect((await (await h.signedIn(SIGN_INS.owner)).post('/api/staff/invites').send({ email, name: 'Quillon Tarrant', role: 'technician', locationId: den })).status).toBe(201);
    later(61);
    expect((await invite(freshEmail('new-hire'))).status).toBe(201);
  });

  it('does not count an invite refused for its address', async () => {
    const lead = await h.signedIn(SIGN_INS.lead);
    const den = (await demoIds(h.db)).location('DEN');
    const taken = await lead.post('/api/staff/invites').send({ email: SIGN_INS.tech, name: 'Someone', role: 'technician', locationId: den });
    expect(taken.status).toBe(409);
    expect(await h.db.selectFrom('mailSends').select('id').execute()).toEqual([]);
  });
});

describe('return requests to vendors', () => {
  let clerk: Agent;
  async function readyClaim(): Promise<ClaimDetail> {
    const unit = await addDeliveredUnit(h.db, (await demoIds(h.db)).location('DEN'));
    const claim = (await clerk.post('/api/claims').send({ buildItemId: unit.buildItemId, failedOn: '2026-06-02', failureMode: 'other', coverage: 'vendor_defect', symptoms: 'Dead' })).body as ClaimDetail;
    await uploadEvidence(clerk, claim.id, SMALL_PNG, 'dead.png');
    return (await clerk.post(`/api/claims/${claim.id}/status`).send({ version: claim.version, to: 'evidence_ready' })).body;
  }
  beforeEach(async () => {
    clerk = await h.signedIn(SIGN_INS.warranty);
  });

  it('tries one claim at most 3 times an hour while the mail server is down, and leaves the claim as it was', async () => {
    const claim = await readyClaim();
    await h.mail.close();
    for (let i = 0; i < 3; i++) expect((await clerk.post(`/api/claims/${claim.id}/send`).send({ version: claim.version })).status).toBe(502);
    const logged = await h.db.selectFrom('mailLog').select('id').execute();
    const refused = await clerk.post(`/api/claims/${claim.id}/send`).send({ version: claim.version });
    expect(refused.status).toBe(429);
    expect(refused.body.error.message).toBe("This claim's return request has already been tried 3 times in the last hour. Try again in 60 minutes.");
    expect(await h.db.selectFrom('mailLog').select('id').execute()).toEqual(logged);
    const after = (await clerk.get(`/api/claims/${claim.id}`)).body as ClaimDetail;
    expect(after).toMatchObject({ status: 'evidence_ready', version: claim.version });
    expect(after.events.filter((e) => e.note?.includes('failed'))).toHaveLength(3);
    later(60);
    const back = await startMailCapture(h.mail.port);
    try {
      expect((await clerk.post(`/api/claims/${claim.id}/send`).send({ version: claim.version })).body.status).toBe('sent_to_vendor');
      expect(back.messages).toHaveLength(1);
    } finally {
      await back.close();
    }
  });

  it('lets one person send at most 60 return requests an hour', async () => {
    const clerkId = (await demoIds(h.db)).user(SIGN_INS.warranty);
    for (let other = 1; other <= 60; other++) await countMail(h.db, vendorRequestLimits(100_000 + other, clerkId), h.clock.now);
    const claim = await readyClaim();
    const sent = h.mail.messages.length;
    const refused = await clerk.post(`/api/claims/${claim.id}/send`).send({ version: claim.version });
    expect(refused.status).toBe(429);
    expect(refused.body.error.message).toBe('You have already sent 60 return requests in the last hour. Try again in 60 minutes.');
    expect(h.mail.messages).toHaveLength(sent);
    later(61);
    expect((await clerk.post(`/api/claims/${claim.id}/send`).send({ version: claim.version })).body.status).toBe('sent_to_vendor');
  });
});

describe('the local mail catcher', () => {
  it('keeps only the newest messages, within a number and a size, dropping the oldest', async () => {
    const capture = await startMailCapture(0, '127.0.0.1', { maxMessages: 3, maxBytes: 12_000 });
    const mailer = createMailer(h.db, `smtp://127.0.0.1:${capture.port}`, 'Busbar <no-reply@busbar.test>', () => h.clock.now, true);
    const subjects = async () => Promise.all(capture.messages.map(async (m) => (await simpleParser(m.raw)).subject));
    try {
      for (let i = 1; i <= 5; i++) await mailer.send({ to: 'someone@example.test', subject: `Message ${i}`, text: 'Short.' });
      expect(await subjects()).toEqual(['Message 3', 'Message 4', 'Message 5']);
      await mailer.send({ to: 'someone@example.test', subject: 'Large 1', text: 'x'.repeat(5_000) });
      await mailer.send({ to: 'someone@example.test', subject: 'Large 2', text: 'y'.repeat(5_000) });
      expect(await subjects()).toEqual(['Message 5', 'Large 1', 'Large 2']);
      await mailer.send({ to: 'someone@example.test', subject: 'Large 3', text: 'z'.repeat(5_000) });
      expect(await subjects()).toEqual(['Large 2', 'Large 3']);
      expect(capture.messages.reduce((sum, m) => sum + Buffer.byteLength(m.raw), 0)).toBeLessThanOrEqual(12_000);
    } finally {
      mailer.close();
      await capture.close();
    }
  });
});
