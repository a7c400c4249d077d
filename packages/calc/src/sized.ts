import type { SizedChoice } from './plan-types.ts';

// Sizes sold commonly enough that a shop can get them (common practice, no source); past the list,
// steps of the last gap (banks and chargers in parallel).
/** House bank sizes, Ah. */
export const COMMON_BANK_AH = [50, 75, 100, 125, 150, 200, 250, 300, 400, 500, 600] as const;
/** DC-DC charger outputs, A. */
export const COMMON_CHARGER_A = [10, 20, 25, 30, 40, 50, 60] as const;

function commonStep(minimum: number, steps: readonly number[]): number {
  const listed = steps.find((size) => size >= minimum - 1e-9);
  if (listed !== undefined) return listed;
  const gap = steps.at(-1)! - steps.at(-2)!;
  return Math.ceil((minimum - 1e-9) / gap) * gap;
}

/** The smallest size at least the minimum: from the shop's catalog when it has one that big, else from the common steps. */
export function sizeToBuy(minimum: number, catalog: readonly number[] | undefined, steps: readonly number[]): SizedChoice {
  const fromCatalog = (catalog ?? []).filter((size) => size >= minimum - 1e-9).sort((a, b) => a - b)[0];
  return fromCatalog === undefined ? { minimum, size: commonStep(minimum, steps), rule: 'common-steps' } : { minimum, size: fromCatalog, rule: 'catalog' };
}
