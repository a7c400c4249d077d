import { createAbility, defineRulesFor, type ClaimDetail, type ClaimStatus, type Role } from '@busbar/shared';
import { describe, expect, it } from 'vitest';
import { approvalRefusal, movesFor } from '../../apps/web/src/views/claims/claimMoves.ts';
import { claimStages } from '../../apps/web/src/views/claims/claimStatus.ts';

const DEN = 1;
const abilityOf = (role: Role, locationIds = [DEN]) =>
  createAbility(
    defineRulesFor({
      id: 7,
      assignments: [{ role, scope: role === 'regional_manager' ? 'region' : 'location', regionId: 1, locationId: role === 'regional_manager' ? null : DEN, locationIds }],
    }),
  );
const claimAt = (status: ClaimStatus, locationId = DEN) =>
  ({ id: 3, number: 'DEN-W00003', locationId, status, creditRequestedCents: 12_000, creditApprovedCents: status === 'approved' ? 10_000 : null }) as ClaimDetail;
const offered = (role: Role, status: ClaimStatus, locationId = DEN) => movesFor(abilityOf(role), claimAt(status, locationId)).map((m) => m.okText);

describe('the workflow steps a claim page offers', () => {
  it("offers the vendor's answer to those who approve, never to the clerk or the accountant", () => {
    expect(offered('location_lead', 'sent_to_vendor')).toEqual(['Record approval', 'Deny']);
    expect(offered('regional_manager', 'sent_to_vendor')).toEqual(['Record approval', 'Deny']);
    expect(offered('warranty_clerk', 'sent_to_vendor')).toEqual([]);
    expect(offered('accountant', 'sent_to_vendor')).toEqual([]);
  });

  it('starts the approval at the credit asked and the credit received at the credit approved', () => {
    const [approve] = movesFor(abilityOf('location_lead'), claimAt('sent_to_vendor'));
    expect(approve?.amount).toMatchObject({ field: 'creditApprovedCents', startCents: 12_000 });
    const [credit] = movesFor(abilityOf('warranty_clerk'), claimAt('approved'));
    expect(credit).toMatchObject({ to: 'credited', amount: { field: 'creditReceivedCents', startCents: 10_000 } });
  });

  it('lets those who work the claim close it, and offers nothing at a shop the person does not work at', () => {
    expect(offered('warranty_clerk', 'credited')).toEqual(['Close the claim']);
    expect(offered('location_lead', 'denied')).toEqual(['Close the claim']);
    expect(offered('regional_manager', 'credited')).toEqual([]);
    expect(offered('location_lead', 'sent_to_vendor', 2)).toEqual([]);
    expect(offered('warranty_clerk', 'closed')).toEqual([]);
  });

  it("offers a lead approval only up to the shop's limit, saying the regional manager approves above it", () => {
    const above = { ...claimAt('sent_to_vendor'), approvalLimitCents: 10_000 };
    expect(movesFor(abilityOf('location_lead'), above).map((m) => m.okText)).toEqual(['Deny']);
    expect(approvalRefusal(abilityOf('location_lead'), above, above.creditRequestedCents)).toBe("$120.00 is above this shop's approval limit of $100.00: the regional manager approves it.");
    expect(approvalRefusal(abilityOf('location_lead'), above, 10_000)).toBeNull();
    expect(movesFor(abilityOf('regional_manager'), above).map((m) => m.okText)).toEqual(['Record approval', 'Deny']);
    expect(approvalRefusal(abilityOf('regional_manager'), above, 500_000)).toBeNull();
    // Someone who records no vendor answers is told nothing about approving.
    expect(approvalRefusal(abilityOf('warranty_clerk'), above, above.creditRequestedCents)).toBeNull();
    const within = { ...above, approvalLimitCents: 12_000 };
    expect(movesFor(abilityOf('location_lead'), within).map((m) => m.okText)).toEqual(['Record approval', 'Deny']);
  });

  it('draws a denied claim without the credit stages', () => {
    expect(claimStages(false)).toEqual(['logged', 'evidence_ready', 'sent_to_vendor', 'approved', 'credited', 'closed']);
    expect(claimStages(true)).toEqual(['logged', 'evidence_ready', 'sent_to_vendor', 'denied', 'closed']);
  });
});
