import { CATEGORIES, CLAIM_STATUSES, COVERAGES, FAILURE_MODES, type Category, type ClaimStatus, type Coverage, type FailureMode } from '@busbar/shared';
import type { LocationQuery } from 'vue-router';
import { positiveInt } from '../../composables/usePagedList.ts';

const oneOf = <T extends string>(list: readonly T[], value: unknown): T | undefined => list.find((v) => v === value);
const isoDate = (value: unknown) => (typeof value === 'string' && /^\d{4}-\d{2}-\d{2}$/.test(value) ? value : undefined);

/** The claim queue's filters as the address bar holds them; anything unknown is dropped. */
export function readClaimFilters(query: LocationQuery) {
  return {
    status: oneOf<ClaimStatus>(CLAIM_STATUSES, query.status),
    coverage: oneOf<Coverage>(COVERAGES, query.coverage),
    failureMode: oneOf<FailureMode>(FAILURE_MODES, query.failureMode),
    vendorId: positiveInt(query.vendorId),
    category: oneOf<Category>(CATEGORIES, query.category),
    locationId: positiveInt(query.locationId),
    failedFrom: isoDate(query.failedFrom),
    failedTo: isoDate(query.failedTo),
    loggedFrom: isoDate(query.loggedFrom),
    loggedTo: isoDate(query.loggedTo),
    overdue: query.overdue === 'true' ? ('true' as const) : undefined,
  };
}

export type ClaimFilters = ReturnType<typeof readClaimFilters>;

export const isFiltered = (f: ClaimFilters) => Object.values(f).some((v) => v !== undefined);

/** Every filter cleared, as a change for the address bar. */
export const NO_CLAIM_FILTERS = Object.fromEntries(Object.keys(readClaimFilters({})).map((key) => [key, undefined])) as Record<keyof ClaimFilters, undefined>;
