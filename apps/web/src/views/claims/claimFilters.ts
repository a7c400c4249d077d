import { CLAIM_STATUSES, COVERAGES, FAILURE_MODES, type ClaimStatus, type Coverage, type FailureMode } from '@busbar/shared';
import type { LocationQuery } from 'vue-router';
import { positiveInt } from '../../composables/usePagedList.ts';

const oneOf = <T extends string>(list: readonly T[], value: unknown): T | undefined => list.find((v) => v === value);

/** The claim queue's filters as the address bar holds them; anything unknown is dropped. */
export function readClaimFilters(query: LocationQuery) {
  return {
    status: oneOf<ClaimStatus>(CLAIM_STATUSES, query.status),
    coverage: oneOf<Coverage>(COVERAGES, query.coverage),
    failureMode: oneOf<FailureMode>(FAILURE_MODES, query.failureMode),
    locationId: positiveInt(query.locationId),
    overdue: query.overdue === 'true' ? ('true' as const) : undefined,
  };
}

export type ClaimFilters = ReturnType<typeof readClaimFilters>;

export const isFiltered = (f: ClaimFilters) => Object.values(f).some((v) => v !== undefined);
