import type { ClaimDetail } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { auditOf } from '../support/catalog-fixtures.ts';
import { addDeliveredUnit, sendWithEvidence, uploadEvidence } from '../support/claim-fixtures.ts';
import { SIGN_INS, signInEveryone, type SignIn } from '../support/staff-fixtures.ts';

let h: Harness;
let ids: Awaited<ReturnType<typeof demoIds>>;
let agents: Record<SignIn, Agent>;
let unit: Awaited<ReturnType<typeof addDeliveredUnit>>;

const claimBody = (buildItemId: number, extra: Record<string, unknown> = {}) => ({
  buildItemId,
  failedOn: '2026-06-10',
  failureMode: 'will_not_charge',
  coverage: 'vendor_defect',
  symptoms: 'Bank stops taking charge at 60 %',
  creditRequestedCents: 30_000,
  ...extra,
});

beforeAll(async () => {
  h = await startHarness();
  ids = await demoIds(h.db);
  agents = await signInEveryone(h);
  unit = await addDeliveredUnit(h.db, ids.location('DEN'));
});
afterAll(() => h.close());

async function move(who: SignIn, claim: ClaimDetail, to: string, extra: Record<string, unknown> = {}) {
  return agents[who].post(`/api/claims/${claim.id}/status`).send({ version: claim.version, to, ...extra });
}

describe('a claim from logging to closing', () => {
  it('is logged by the clerk against the failed unit, numbered per location, with its first event and audit', async () => {
    const res = await agents.warranty.post('/api/claims').send(claimBody(unit.buildItemId));
    expect(res.status).toBe(201);
    const claim = res.body as ClaimDetail;
    expect(claim).toMatchObject({ number: 'DEN-W00001', status: 'logged', buildId: unit.buildId, sku: unit.item.sku, outOfWarranty: false, installedOn: '2026-03-01' });
    expect(claim.events).toEqual([expect.objectContaining({ fromStatus: null, toStatus: 'logged', actorName: expect.any(String) })]);
    expect((await auditOf(h.db, 'claim', claim.id)).map((a) => a.action)).toEqual(['claim.create']);
  });

  it('walks the workflow with who may take each step, the lead approving within the limit', async () => {
    let claim = (await agents.warranty.post('/api/claims').send(claimBody(unit.buildItemId))).body as ClaimDetail;
    expect((await move('warranty', claim, 'evidence_ready')).body.error.fields.to).toContain('Upload a photo');
    expect((await move('tech', claim, 'evidence_ready')).status).toBe(404);
    claim = await sendWithEvidence(agents.warranty, claim);
    expect(claim.status).toBe('sent_to_vendor');
    expect((await move('warranty', claim, 'approved')).status).toBe(403);
    const approved = await move('lead', claim, 'approved', { creditApprovedCents: 28_000, note: 'Vendor RMA granted' });
    expect(approved.status).toBe(200);
    claim = approved.body;
    expect(claim).toMatchObject({ status: 'approved', creditApprovedCents: 28_000 });
    expect((await move('warranty', claim, 'credited')).body.error.fields).toHaveProperty('creditReceivedCents');
    claim = (await move('warranty', claim, 'credited', { creditReceivedCents: 28_000 })).body;
    claim = (await move('warranty', claim, 'closed')).body;
    expect(claim.events.map((e) => e.toStatus)).toEqual(['logged', 'evidence_ready', 'sent_to_vendor', 'approved', 'credited', 'closed']);
    expect(claim.events[2]?.note).toMatch(/^Return request e-mailed to rma\.\d+@vendor\.busbar\.test with 1 file$/);
    expect(claim.events[3]).toMatchObject({ note: 'Vendor RMA granted', actorName: expect.any(String) });
  });

  it('sends a credit above the location limit to the regional manager', async () => {
    let claim = (await agents.warranty.post('/api/claims').send(claimBody(unit.buildItemId, { creditRequestedCents: 120_000 }))).body as ClaimDetail;
    claim = await sendWithEvidence(agents.warranty, claim);
    const byLead = await move('lead', claim, 'approved');
    expect(byLead.status).toBe(403);
    expect(byLead.body.error.message).toContain('regional manager');
    expect((await move('lead', claim, 'approved', { creditApprovedCents: 40_000 })).status).toBe(200);
  });

  it('lets the regional manager approve above the limit and the lead deny', async () => {
    const claim = await sendWithEvidence(agents.warranty, (await agents.warranty.post('/api/claims').send(claimBody(unit.buildItemId, { creditRequestedCents: 120_000 }))).body);
    expect((await move('regional', claim, 'approved')).body).toMatchObject({ status: 'approved', creditApprovedCents: 120_000 });
    const other = await sendWithEvidence(agents.warranty, (await agents.warranty.post('/api/claims').send(claimBody(unit.buildItemId))).body);
    expect((await move('lead', other, 'denied', { note: 'Vendor found impact damage' })).body.status).toBe('denied');
  });

  it('refuses steps the workflow does not have, and stale versions', async () => {
    const claim = (await agents.warranty.post('/api/claims').send(claimBody(unit.buildItemId))).body as ClaimDetail;
    expect((await move('warranty', claim, 'credited')).status).toBe(400);
    await uploadEvidence(agents.warranty, claim.id);
    expect((await move('warranty', claim, 'evidence_ready')).status).toBe(200);
    expect((await move('warranty', claim, 'logged')).status).toBe(409);
  });

  it('takes edits until the vendor answers, then refuses them', async () => {
    let claim = (await agents.warranty.post('/api/claims').send(claimBody(unit.buildItemId))).body as ClaimDetail;
    const edited = await agents.warranty.patch(`/api/claims/${claim.id}`).send({ version: claim.version, vendorRmaNumber: 'RMA-5521', laborHours: 1.5 });
    expect(edited.body).toMatchObject({ vendorRmaNumber: 'RMA-5521', laborHours: 1.5, version: 2 });
    claim = await sendWithEvidence(agents.warranty, edited.body);
    claim = (await move('lead', claim, 'denied')).body;
    expect((await agents.warranty.patch(`/api/claims/${claim.id}`).send({ version: claim.version, symptoms: 'x' })).status).toBe(409);
  });
});

describe('what a claim may be logged for', () => {
  it('refuses a failure before delivery or in the future, and a unit of a build not yet delivered', async () => {
    expect((await agents.warranty.post('/api/claims').send(claimBody(unit.buildItemId, { failedOn: '2026-02-01' }))).body.error.fields).toHaveProperty('failedOn');
    expect((await agents.warranty.post('/api/claims').send(claimBody(unit.buildItemId, { failedOn: '2026-07-01' }))).body.error.fields).toHaveProperty('failedOn');
    await h.db.updateTable('builds').set({ status: 'quality_check' }).where('id', '=', unit.buildId).execute();
    expect((await agents.warranty.post('/api/claims').send(claimBody(unit.buildItemId))).body.error.fields).toHaveProperty('buildItemId');
    await h.db.updateTable('builds').set({ status: 'delivered' }).where('id', '=', unit.buildId).execute();
  });

  it('warns past the warranty and lets only a lead go ahead as goodwill', async () => {
    const old = await addDeliveredUnit(h.db, ids.location('DEN'), { deliveredAt: '2024-01-10T18:00:00.000Z', warrantyMonths: 24 });
    const asDefect = await agents.warranty.post('/api/claims').send(claimBody(old.buildItemId));
    expect(asDefect.status).toBe(400);
    expect(asDefect.body.error.fields.coverage).toContain('2026-01-10');
    expect((await agents.warranty.post('/api/claims').send(claimBody(old.buildItemId, { coverage: 'goodwill' }))).status).toBe(403);
    const byLead = await agents.lead.post('/api/claims').send(claimBody(old.buildItemId, { coverage: 'goodwill' }));
    expect(byLead.status).toBe(201);
    expect(byLead.body).toMatchObject({ outOfWarranty: true, coverage: 'goodwill' });
  });

  it('refuses what the form would not send', async () => {
    const res = await agents.warranty.post('/api/claims').send({ ...claimBody(unit.buildItemId), failureMode: 'gremlins', symptoms: ' ' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['failureMode', 'symptoms']);
  });
});

describe('the queue', () => {
  it('puts the next step due soonest first, says what is overdue, and filters to it', async () => {
    const fresh = (await agents.warranty.post('/api/claims').send(claimBody(unit.buildItemId))).body as ClaimDetail;
    // Logged on 2026-06-15 (Denver): evidence is due within 3 days.
    expect(fresh).toMatchObject({ dueOn: '2026-06-18', overdue: false });
    h.clock.now = new Date('2026-06-25T15:00:00Z');
    try {
      // Sessions last 12 hours on the clock: ten days on, the clerk signs in again.
      const clerk = await h.signedIn(SIGN_INS.warranty);
      const later = (await clerk.post('/api/claims').send(claimBody(unit.buildItemId))).body as ClaimDetail;
      const queue = (await clerk.get('/api/claims').query({ pageSize: 100 })).body.items as ClaimDetail[];
      const open = queue.filter((c) => c.dueOn !== null);
      expect(open.map((c) => c.dueOn)).toEqual([...open.map((c) => c.dueOn)].sort());
      expect(queue.findIndex((c) => c.dueOn === null)).toBeGreaterThanOrEqual(open.length);
      expect(queue.find((c) => c.id === fresh.id)).toMatchObject({ overdue: true });
      const overdue = (await clerk.get('/api/claims').query({ overdue: 'true', pageSize: 100 })).body.items as ClaimDetail[];
      expect(overdue.map((c) => c.id)).toContain(fresh.id);
      expect(overdue.map((c) => c.id)).not.toContain(later.id);
      expect(overdue.every((c) => c.overdue)).toBe(true);
    } finally {
      h.clock.now = new Date('2026-06-15T15:00:00Z');
    }
  });
});
