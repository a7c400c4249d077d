import type { ClaimDetail } from '@busbar/shared';
import { getClaim } from '../../api/claims.ts';
import { recordStateKey, useRecordState, useVersionedRecord, type RecordChange } from '../../composables/useVersionedRecord.ts';

export type ClaimChange = RecordChange<ClaimDetail>;

const stateKey = recordStateKey('claim');

/** The stale notice and reload of the claim page, for dialogs that cover the page's own notice. */
export const useClaimState = () => useRecordState(stateKey);

/** One claim on screen, changed version by version (see useVersionedRecord); uploads replace it whole. */
export function useClaim(id: () => number) {
  const { record: claim, ...rest } = useVersionedRecord(id, getClaim, stateKey);
  return { claim, ...rest };
}
