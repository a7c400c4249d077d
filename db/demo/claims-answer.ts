import { addWorkdays, isoDay, localMoment } from '@busbar/calc';
import type { ClaimStatus, Coverage } from '@busbar/shared';
import { between, chance, type Random } from './draw.ts';
import type { ClaimDraft } from './claims-draw.ts';
import { pick } from './random.ts';

/** How often the vendor approves, by who was found to pay (invented for the demo). */
const APPROVAL_SHARE: Record<Coverage, number> = { vendor_defect: 0.88, workmanship: 0.12, goodwill: 0.5 };

const DENIALS: Record<Coverage, readonly string[]> = {
  vendor_defect: ['Vendor tested the unit within its specification: no fault found', 'Vendor found the unit used outside its rating'],
  workmanship: ['Vendor: burnt terminal from a loose connection, not a defect of the unit', 'Vendor: damage from the install, not covered'],
  goodwill: ['Vendor declined goodwill for a unit past its warranty', 'Vendor declined: damage not covered'],
};

const EVIDENCE_NOTES = ['Unit inspected; evidence attached', 'Unit on the bench; inspection sheet attached', 'Customer photos and our inspection attached'];
const dollars = (cents: number) => `$${(cents / 100).toLocaleString('en-US', { minimumFractionDigits: 2 })}`;
const rmaNumber = (random: Random, sku: string) => `RMA-${sku.slice(0, 3)}-${between(random, 10000, 99999)}`;

/** An instant and its local day at the shop, carried along so the day is not worked out again (it is the slow part). */
export interface Moment {
  at: number;
  day: number;
}

/**
 * A moment in opening hours `workdays` working days after `from` in the shop's zone, at least a
 * few minutes after it: the next working day when that day's hours are already past.
 */
export function laterAt(random: Random, zone: string, from: Moment, workdays: number): Moment {
  const soonest = from.at + between(random, 10, 90) * 60_000;
  const minute = between(random, 480, 1050);
  const day = addWorkdays(from.day, workdays);
  const at = localMoment(zone, day, minute);
  if (at >= soonest) return { at, day };
  const nextDay = addWorkdays(day, 1);
  return { at: localMoment(zone, nextDay, minute), day: nextDay };
}

/** Fixes the replacement's day, or drops it when it had not happened by the clock or came after the claim was closed. */
function settleReplacement(draft: ClaimDraft, nowMs: number): void {
  const closed = draft.steps.find((s) => s.to === 'closed');
  const at = draft.replacement?.at;
  if (at === undefined || at > nowMs || (closed && at >= closed.at)) draft.replacement = null;
  else draft.replacement!.on = isoDay(draft.replacement!.day);
}

/**
 * The claim's steps after it is logged, each a few working days after the last (now and then
 * much later, so some are overdue), cut at the clock: the clerk readies the evidence and sends
 * the request; the vendor answers, recorded by the lead (the regional manager above the shop's
 * approval limit); an approval is credited and closed, a denial closed. The note of the send
 * names the files, so it is written once the claim has its number (claims-rows.ts).
 */
export function claimAnswer(random: Random, draft: ClaimDraft, nowMs: number): void {
  const { shop, steps, unit } = draft;
  const step = (to: ClaimStatus, workdays: number, by: number, note: string): boolean => {
    const { at, day } = laterAt(random, shop.timeZone, steps[steps.length - 1]!, workdays);
    if (at > nowMs) return false;
    steps.push({ at, day, by, to, note });
    return true;
  };
  const done = () => settleReplacement(draft, nowMs);
  if (!step('evidence_ready', chance(random, 0.25) ? between(random, 5, 20) : between(random, 0, 2), shop.clerkId, pick(random, EVIDENCE_NOTES))) return done();
  if (!step('sent_to_vendor', chance(random, 0.2) ? between(random, 3, 8) : between(random, 0, 2), shop.clerkId, '')) return done();
  const approved = chance(random, APPROVAL_SHARE[draft.coverage]);
  const full = draft.coverage === 'vendor_defect' && chance(random, 0.8);
  const creditCents = full ? draft.creditRequestedCents : Math.round((draft.creditRequestedCents * between(random, 0.3, 0.8, 0.05)) / 100) * 100;
  const rma = rmaNumber(random, unit.sku);
  const approver = approved && creditCents > shop.approvalLimitCents ? shop.managerId : shop.leadId;
  const answer = approved ? `Vendor approved under ${rma}: credit of ${dollars(creditCents)}` : pick(random, DENIALS[draft.coverage]);
  if (!step(approved ? 'approved' : 'denied', between(random, 3, 20), approver, answer)) return done();
  draft.vendorRmaNumber = rma;
  if (approved) {
    draft.creditApprovedCents = creditCents;
    // The vendor ships the replacement a few days after approving.
    draft.replacement ??= { ...laterAt(random, shop.timeZone, steps[steps.length - 1]!, between(random, 2, 8)), on: '', by: shop.clerkId };
    const receivedCents = chance(random, 0.9) ? creditCents : creditCents - Math.min(2500, creditCents);
    const fee = receivedCents < creditCents ? ' less the vendor\'s handling fee' : '';
    if (!step('credited', between(random, 8, 32), shop.clerkId, `Credit of ${dollars(receivedCents)} received${fee}`)) return done();
    draft.creditReceivedCents = receivedCents;
    step('closed', between(random, 1, 6), shop.clerkId, 'Credit matched to the vendor statement');
  } else {
    step('closed', between(random, 1, 8), shop.clerkId, draft.coverage === 'workmanship' ? 'Shop covered the repair as its own workmanship' : 'Customer told of the vendor\'s answer');
  }
  done();
}
