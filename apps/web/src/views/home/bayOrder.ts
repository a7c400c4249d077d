import type { BuildStatus, BuildView } from '@busbar/shared';

/** Builds in the final check first (nearest done), then those in the bay, each by the day booked. */
const STAGE_ORDER: Partial<Record<BuildStatus, number>> = { quality_check: 0, in_bay: 1 };

export function inBayOrder(builds: BuildView[]): BuildView[] {
  return [...builds].sort(
    (a, b) => (STAGE_ORDER[a.status] ?? 9) - (STAGE_ORDER[b.status] ?? 9) || (a.bookedFor ?? '').localeCompare(b.bookedFor ?? '') || a.number.localeCompare(b.number),
  );
}
