import type { ClaimDetail } from '@busbar/shared';
import { formatMoney } from '../../format.ts';
import { wasDenied } from './claimStatus.ts';

/**
 * What the claim's approved and received credit read in its status: the amount once recorded,
 * "Not yet" while the vendor's answer or the credit is awaited, and plainly none once denied.
 */
export function creditWords(claim: Pick<ClaimDetail, 'status' | 'events' | 'creditApprovedCents' | 'creditReceivedCents'>): { approved: string; received: string } {
  if (wasDenied(claim)) return { approved: 'None: the vendor denied the claim', received: 'None' };
  const money = (cents: number | null) => (cents === null ? 'Not yet' : formatMoney(cents));
  return { approved: money(claim.creditApprovedCents), received: money(claim.creditReceivedCents) };
}
