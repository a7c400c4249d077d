import type { ClaimDetail, ClaimEventView, ClaimStatus } from '@busbar/shared';
import { describe, expect, it } from 'vitest';
import { creditWords } from '../../apps/web/src/views/claims/claimCredit.ts';

const event = (fromStatus: ClaimStatus | null, toStatus: ClaimStatus): ClaimEventView => ({ at: '2026-06-01T16:00:00.000Z', actorName: 'Ingrid Salazar', fromStatus, toStatus, note: '' });
/** A claim in `status` that passed through `path` (each status it was moved to, in order). */
const claim = (status: ClaimStatus, path: ClaimStatus[], creditApprovedCents: number | null = null, creditReceivedCents: number | null = null) =>
  ({ status, creditApprovedCents, creditReceivedCents, events: path.map((to, i) => event(i === 0 ? null : path[i - 1]!, to)) }) as ClaimDetail;

const SENT: ClaimStatus[] = ['logged', 'evidence_ready', 'sent_to_vendor'];

describe("a claim's approved and received credit, in words, in every status", () => {
  it('says "Not yet" until the vendor answers', () => {
    for (const [i, status] of SENT.entries()) expect(creditWords(claim(status, SENT.slice(0, i + 1)))).toEqual({ approved: 'Not yet', received: 'Not yet' });
  });

  it('gives the approved amount once approved, and the received amount once credited and after closing', () => {
    expect(creditWords(claim('approved', [...SENT, 'approved'], 28_000))).toEqual({ approved: '$280.00', received: 'Not yet' });
    expect(creditWords(claim('credited', [...SENT, 'approved', 'credited'], 28_000, 27_550))).toEqual({ approved: '$280.00', received: '$275.50' });
    expect(creditWords(claim('closed', [...SENT, 'approved', 'credited', 'closed'], 28_000, 27_550))).toEqual({ approved: '$280.00', received: '$275.50' });
  });

  it('says plainly that a denied claim gets no credit, while denied and after it is closed', () => {
    const none = { approved: 'None: the vendor denied the claim', received: 'None' };
    expect(creditWords(claim('denied', [...SENT, 'denied']))).toEqual(none);
    expect(creditWords(claim('closed', [...SENT, 'denied', 'closed']))).toEqual(none);
  });
});
