import { claimRuleSubject, createAbility, type ClaimDetail, type SessionView } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addDeliveredUnit, sendWithEvidence } from '../support/claim-fixtures.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

let h: Harness;
let den: number;
let owner: Agent;
let clerk: Agent;
let lead: Agent;
let regional: Agent;

beforeAll(async () => {
  h = await startHarness();
  den = (await demoIds(h.db)).location('DEN');
  owner = await h.signedIn(SIGN_INS.owner);
  clerk = await h.signedIn(SIGN_INS.warranty);
  lead = await h.signedIn(SIGN_INS.lead);
  regional = await h.signedIn(SIGN_INS.regional);
});
afterAll(() => h.close());

/** A claim at Denver asking `creditRequestedCents`, sent to its vendor by the clerk. */
async function sentClaim(creditRequestedCents: number): Promise<ClaimDetail> {
  const unit = await addDeliveredUnit(h.db, den);
  const logged = await clerk.post('/api/claims').send({ buildItemId: unit.buildItemId, failedOn: '2026-06-01', failureMode: 'overheating', coverage: 'vendor_defect', symptoms: 'Case too hot to touch', creditRequestedCents });
  return sendWithEvidence(clerk, logged.body);
}

/** Whether the person's own rules, as the browser gets them, let them approve the credit the claim asks. */
async function mayApproveAsked(agent: Agent, claimId: number): Promise<boolean> {
  const session = (await agent.get('/api/session')).body as SessionView;
  const claim = (await agent.get(`/api/claims/${claimId}`)).body as ClaimDetail;
  return createAbility(session.rules).can('approve', claimRuleSubject(claim, claim.creditRequestedCents));
}

const approve = (agent: Agent, claim: ClaimDetail, extra: Record<string, unknown> = {}) =>
  agent.post(`/api/claims/${claim.id}/status`).send({ version: claim.version, to: 'approved', ...extra });

describe("a location's approval limit on its claims", () => {
  it('answers the limit the owner set with the claim, so the rules tell a lead from the regional manager', async () => {
    expect((await owner.patch(`/api/locations/${den}`).send({ claimApprovalLimitCents: 20_000 })).status).toBe(200);
    const claim = await sentClaim(30_000);
    for (const agent of [clerk, lead, regional]) expect((await agent.get(`/api/claims/${claim.id}`)).body.approvalLimitCents).toBe(20_000);
    expect(await mayApproveAsked(lead, claim.id)).toBe(false);
    expect(await mayApproveAsked(regional, claim.id)).toBe(true);

    const byLead = await approve(lead, claim);
    expect([byLead.status, byLead.body.error.message]).toEqual([403, 'This credit is above the location’s approval limit of $200.00: the regional manager approves it']);
    expect((await approve(regional, claim)).body).toMatchObject({ status: 'approved', creditApprovedCents: 30_000 });
  });

  it('lets a lead approve up to the limit, and a raised limit at once', async () => {
    const within = await sentClaim(20_000);
    expect(await mayApproveAsked(lead, within.id)).toBe(true);
    expect((await approve(lead, within)).body).toMatchObject({ status: 'approved', creditApprovedCents: 20_000 });

    const above = await sentClaim(35_000);
    expect(await mayApproveAsked(lead, above.id)).toBe(false);
    expect((await owner.patch(`/api/locations/${den}`).send({ claimApprovalLimitCents: 40_000 })).status).toBe(200);
    expect(await mayApproveAsked(lead, above.id)).toBe(true);
    expect((await approve(lead, above)).body).toMatchObject({ status: 'approved', creditApprovedCents: 35_000 });
  });
});
