import type { AppAbility, ClaimDetail, ClaimStatus } from '@busbar/shared';
import { claimSubject } from './claimStatus.ts';

/** A workflow step as its dialog shows it. */
export interface Move {
  to: ClaimStatus;
  title: string;
  okText: string;
  /** The credit this step records, with the amount it starts from. */
  amount?: { field: 'creditApprovedCents' | 'creditReceivedCents'; label: string; startCents: number };
}

/**
 * The workflow steps this person may take on the claim now, as dialogs. Approving is offered to
 * whoever may approve at the location; a credit above the lead's limit is refused by the API with
 * the reason (the regional manager approves it), shown on the dialog.
 */
export function movesFor(ability: AppAbility, claim: ClaimDetail): Move[] {
  const can = (action: 'update' | 'approve') => ability.can(action, claimSubject(claim));
  const moves: Move[] = [];
  if (claim.status === 'sent_to_vendor' && can('approve')) {
    moves.push({
      to: 'approved',
      title: `Record the vendor's approval of ${claim.number}`,
      okText: 'Record approval',
      amount: { field: 'creditApprovedCents', label: 'Credit the vendor approved ($)', startCents: claim.creditRequestedCents },
    });
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
