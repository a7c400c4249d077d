import { CLAIM_STATUSES, type ClaimStatus } from '@busbar/shared';
import type { ClaimDraft } from './claims-draw.ts';

/** Cuts a claim back to where it stood after step `index`: what came later had not happened yet. */
function standAt(draft: ClaimDraft, index: number): void {
  const kept = draft.steps.slice(0, index + 1);
  const reached = (status: ClaimStatus) => kept.some((s) => s.to === status);
  const last = kept[kept.length - 1]!;
  draft.steps = kept;
  if (!reached('approved')) draft.creditApprovedCents = null;
  if (!reached('credited')) draft.creditReceivedCents = null;
  if (!reached('approved') && !reached('denied')) draft.vendorRmaNumber = '';
  // The shop's own repair stands; a vendor's replacement comes only after its approval.
  if (draft.replacement && draft.coverage !== 'workmanship' && draft.replacement.at > last.at) draft.replacement = null;
}

/**
 * The small demo network sees few claims a day, so a status passed through quickly may by chance
 * hold no claim at the clock. For each such status, the claim that left it last is taken to be
 * still there: its later steps had not happened yet. Statuses are taken in workflow order, so a
 * status emptied by this is filled again when its turn comes.
 */
export function holdEveryStatus(drafts: readonly ClaimDraft[]): void {
  for (const status of CLAIM_STATUSES) {
    if (drafts.some((d) => d.steps[d.steps.length - 1]!.to === status)) continue;
    let latest: { draft: ClaimDraft; index: number; leftAt: number } | null = null;
    for (const draft of drafts) {
      const index = draft.steps.findIndex((s) => s.to === status);
      const leftAt = draft.steps[index + 1]?.at;
      if (index >= 0 && leftAt !== undefined && (!latest || leftAt > latest.leftAt)) latest = { draft, index, leftAt };
    }
    if (latest) standAt(latest.draft, latest.index);
  }
}
