import type { ClaimDetail } from '@busbar/shared';
import { simpleParser } from 'mailparser';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startMailCapture } from '../../apps/api/src/mail/capture.ts';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addDeliveredUnit, SMALL_PNG, uploadEvidence } from '../support/claim-fixtures.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

let h: Harness;
let clerk: Agent;
let unit: Awaited<ReturnType<typeof addDeliveredUnit>>;

async function readyClaim(): Promise<ClaimDetail> {
  const claim = (await clerk.post('/api/claims').send({ buildItemId: unit.buildItemId, failedOn: '2026-06-02', failureMode: 'cell_or_bms_fault', coverage: 'vendor_defect', symptoms: 'BMS cuts out at 40 A', foundHow: 'Customer call' })).body as ClaimDetail;
  await uploadEvidence(clerk, claim.id, SMALL_PNG, 'bms-log.png');
  return (await clerk.post(`/api/claims/${claim.id}/status`).send({ version: claim.version, to: 'evidence_ready' })).body;
}

beforeAll(async () => {
  h = await startHarness();
  clerk = await h.signedIn(SIGN_INS.warranty);
  unit = await addDeliveredUnit(h.db, (await demoIds(h.db)).location('DEN'));
});
afterAll(() => h.close());

describe('sending a claim to the vendor', () => {
  it('e-mails the return request with the unit, its dates and the evidence attached, then records it', async () => {
    const claim = await readyClaim();
    const res = await clerk.post(`/api/claims/${claim.id}/send`).send({ version: claim.version });
    expect(res.status).toBe(200);
    const message = h.mail.messages.at(-1)!;
    expect(message.to).toEqual([unit.vendor.rmaEmail]);
    const parsed = await simpleParser(message.raw);
    expect(parsed.subject).toBe(`Return request ${claim.number}: ${claim.itemName}, serial ${claim.serialNumber}`);
    for (const fact of [`Serial number: ${claim.serialNumber}`, 'Installed: 2026-03-01', 'Failed: 2026-06-02', 'Failure: Cell or BMS fault', 'What was seen: BMS cuts out at 40 A', 'How it was found: Customer call'])
      expect(parsed.text).toContain(fact);
    expect(parsed.attachments.map((a) => [a.filename, a.contentType])).toEqual([['bms-log.png', 'image/png']]);
    expect(Buffer.compare(parsed.attachments[0]!.content, SMALL_PNG)).toBe(0);
    expect((res.body as ClaimDetail).status).toBe('sent_to_vendor');
  });

  it('is refused to someone who may not send, before the evidence is ready, and on a stale version', async () => {
    const claim = await readyClaim();
    expect((await (await h.signedIn(SIGN_INS.accountant)).post(`/api/claims/${claim.id}/send`).send({ version: claim.version })).status).toBe(403);
    expect((await clerk.post(`/api/claims/${claim.id}/send`).send({ version: claim.version - 1 })).status).toBe(409);
    const fresh = (await clerk.post('/api/claims').send({ buildItemId: unit.buildItemId, failedOn: '2026-06-02', failureMode: 'other', coverage: 'vendor_defect', symptoms: 'Dead' })).body as ClaimDetail;
    expect((await clerk.post(`/api/claims/${fresh.id}/send`).send({ version: fresh.version })).status).toBe(400);
    expect((await clerk.post(`/api/claims/${claim.id}/status`).send({ version: claim.version, to: 'sent_to_vendor' })).status).toBe(400);
  });

  it('changes nothing when the mail server is down, says so on the claim, and can be sent again', async () => {
    const claim = await readyClaim();
    await h.mail.close();
    const res = await clerk.post(`/api/claims/${claim.id}/send`).send({ version: claim.version });
    expect(res.status).toBe(502);
    const after = (await clerk.get(`/api/claims/${claim.id}`)).body as ClaimDetail;
    expect(after).toMatchObject({ status: 'evidence_ready', version: claim.version });
    expect(after.events.at(-1)).toMatchObject({ toStatus: 'evidence_ready', note: `E-mail to ${unit.vendor.rmaEmail} failed; not sent` });
    const logged = await h.db.selectFrom('mailLog').select(['status', 'text']).orderBy('id', 'desc').executeTakeFirstOrThrow();
    expect(logged.status).toBe('failed');
    expect(logged.text).toContain('Attached: bms-log.png');
    const back = await startMailCapture(h.mail.port);
    try {
      const retried = await clerk.post(`/api/claims/${claim.id}/send`).send({ version: claim.version });
      expect(retried.body.status).toBe('sent_to_vendor');
      expect(back.messages.map((m) => m.to)).toEqual([[unit.vendor.rmaEmail]]);
    } finally {
      await back.close();
    }
  });
});
