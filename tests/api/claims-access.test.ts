import type { ClaimDetail, ClaimView, Page } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addDeliveredUnit } from '../support/claim-fixtures.ts';
import { signInEveryone, type SignIn } from '../support/staff-fixtures.ts';

let h: Harness;
let agents: Record<SignIn, Agent>;
let den: ClaimDetail;
let avl: ClaimDetail;

const body = (buildItemId: number) => ({ buildItemId, failedOn: '2026-06-01', failureMode: 'overheating', coverage: 'workmanship', symptoms: 'Lug too hot to touch' });

beforeAll(async () => {
  h = await startHarness();
  const ids = await demoIds(h.db);
  agents = await signInEveryone(h);
  const denUnit = await addDeliveredUnit(h.db, ids.location('DEN'));
  const avlUnit = await addDeliveredUnit(h.db, ids.location('AVL'));
  den = (await agents.warranty.post('/api/claims').send(body(denUnit.buildItemId))).body;
  avl = (await agents.lead2.post('/api/claims').send(body(avlUnit.buildItemId))).body;
});
afterAll(() => h.close());

describe.each([
  ['owner', ['DEN-W00001', 'AVL-W00001']],
  ['regional', ['DEN-W00001']],
  ['lead', ['DEN-W00001']],
  ['warranty', ['DEN-W00001']],
  ['accountant', ['DEN-W00001', 'AVL-W00001']],
  ['lead2', ['AVL-W00001']],
  ['tech', []],
] as [SignIn, string[]][])('%s', (who, visible) => {
  it('lists the claims of their locations only', async () => {
    const res = await agents[who].get('/api/claims');
    expect(res.status).toBe(200);
    expect((res.body as Page<ClaimView>).items.map((c) => c.number).sort()).toEqual([...visible].sort());
    // The location's limit and zone serve the server only; whether a claim is overdue and out of warranty come as yes or no.
    for (const item of res.body.items) {
      expect(item).not.toHaveProperty('approvalLimitCents');
      expect(item).not.toHaveProperty('timeZone');
      expect(item).toMatchObject({ overdue: false, outOfWarranty: false });
    }
  });

  it('reads a claim of their locations and gets 404 for any other', async () => {
    for (const claim of [den, avl]) {
      const res = await agents[who].get(`/api/claims/${claim.id}`);
      expect(res.status).toBe(visible.includes(claim.number) ? 200 : 404);
      // The detail names the location's approval limit, so the page offers approval only to who may give it.
      if (res.status === 200) expect(res.body.approvalLimitCents).toBe(50_000);
    }
  });
});

describe('changing claims', () => {
  it('refuses to log claims for a technician and the accountant, and at another location for a clerk', async () => {
    const unit = await addDeliveredUnit(h.db, (await demoIds(h.db)).location('DEN'));
    expect((await agents.tech.post('/api/claims').send(body(unit.buildItemId))).status).toBe(403);
    expect((await agents.accountant.post('/api/claims').send(body(unit.buildItemId))).status).toBe(403);
    expect((await agents.lead2.post('/api/claims').send(body(unit.buildItemId))).status).toBe(404);
  });

  it('lets neither the accountant nor a regional manager edit a claim, nor anyone elsewhere see it to edit', async () => {
    expect((await agents.accountant.patch(`/api/claims/${den.id}`).send({ version: den.version, foundHow: 'x' })).status).toBe(403);
    expect((await agents.regional.patch(`/api/claims/${den.id}`).send({ version: den.version, foundHow: 'x' })).status).toBe(403);
    expect((await agents.lead2.patch(`/api/claims/${den.id}`).send({ version: den.version, foundHow: 'x' })).status).toBe(404);
    expect((await agents.warranty.post(`/api/claims/${avl.id}/status`).send({ version: avl.version, to: 'evidence_ready' })).status).toBe(404);
  });

  it('filters the list by status and location, and refuses a page above 100 rows', async () => {
    expect((await agents.owner.get('/api/claims').query({ status: 'approved' })).body.items).toEqual([]);
    expect((await agents.owner.get('/api/claims').query({ locationId: avl.locationId })).body.items.map((c: ClaimView) => c.id)).toEqual([avl.id]);
    expect((await agents.lead.get('/api/claims').query({ locationId: avl.locationId })).body.items).toEqual([]);
    expect((await agents.owner.get('/api/claims').query({ pageSize: 101 })).status).toBe(400);
  });
});
