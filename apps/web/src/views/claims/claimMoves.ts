import { claimRuleSubject, type AppAbility, type ClaimDetail, type ClaimStatus } from '@busbar/shared';
import { formatMoney } from '../../format.ts';

/** A workflow step as its dialog shows it. */
export interface Move {
  to: ClaimStatus;
  title: string;
  okText: string;
  /** The credit this step records, with the amount it starts from. */
  amount?: { field: 'creditApprovedCents' | 'creditReceivedCents'; label: string; startCents: number };
}

/**
 * Why this person may not approve `creditCents` on the claim though they record vendors' answers
 * at its location (a lead above the location's limit), or null when they may.
 */
export function approvalRefusal(ability: AppAbility, claim: ClaimDetail, creditCents: number): string | null {
  if (!ability.can('approve', claimRuleSubject(claim)) || ability.can('approve', claimRuleSubject(claim, creditCents))) return null;
  return `${formatMoney(creditCents)} is above this shop's approval limit of ${formatMoney(claim.approvalLimitCents)}: the regional manager approves it.`;
}

/**
 * The workflow steps this person may take on the claim now, as dialogs. Approving is offered to
 * whoever may approve the credit asked at the location: a lead up to its limit, above it the
 * regional manager (`approvalRefusal` says so instead). Denying is theirs either way.
 */
export function movesFor(ability: AppAbility, claim: ClaimDetail): Move[] {
  const can = (action: 'update' | 'approve') => ability.can(action, claimRuleSubject(claim));
  const moves: Move[] = [];
  if (claim.status === 'sent_to_vendor' && can('approve')) {
    if (approvalRefusal(ability, claim, claim.creditRequestedCents) === null) {
      moves.push({
        to: 'approved',
        title: `Record the vendor's approval of ${claim.number}`,
        okText: 'Record approval',
        amount: { field: 'creditApprovedCents', label: 'Credit the vendor approved ($)', startCents: claim.creditRequestedCents },
      });
    }
    moves.push({ to: 'denied', title: `Record that the vendor denied ${claim.number}`, okText: 'Deny' });
  }
  if (claim.status === 'approved' && can('update')) {
    const startCents = claim.creditApprovedCents ?? claim.creditRequestedCents;
    moves.push({ to: 'credited', title: `Record the credit received for ${claim.number}`, okText: 'Record credit received', amount: { field: 'creditReceivedCents', label: 'Credit received ($)', startCents } });
  }
  if ((claim.status === 'credited' || claim.status === 'denied') && can('update')) {
    moves.push({ to: 'closed', title: `Close ${claim.number}`, okText: 'Close the claim' });
  }
  return moves;
}
