import type { Category, RollupFigures } from '@busbar/shared';
import { SUM_FIELDS, type RollupSums } from './rollups.ts';

export type JobMix = Partial<Record<Category, number>>;

/** Which money a person reads where the figures come from: build prices, build costs. */
export interface MoneyReads {
  prices: boolean;
  costs: boolean;
}

const PRICE_FIGURES = ['revenueCents', 'grossMarginCents', 'averageTicketCents', 'warrantyCostCents', 'warrantyCostShare', 'vendorCreditsReceivedCents'] as const;
const COST_FIGURES = ['partsCostCents', 'grossMarginCents'] as const;

/** The figures of a period made from its sums and job mix, without the money the person may not read. */
export function figuresOf(sums: RollupSums, jobMix: JobMix, reads: MoneyReads): RollupFigures {
  const delivered = sums.buildsDelivered;
  const figures: RollupFigures = {
    buildsDelivered: delivered,
    buildsBooked: sums.buildsBooked,
    revenueCents: sums.revenueCents,
    partsCostCents: sums.partsCostCents,
    grossMarginCents: sums.revenueCents - sums.partsCostCents,
    laborHours: sums.laborCentihours / 100,
    averageTicketCents: delivered > 0 ? Math.round(sums.revenueCents / delivered) : null,
    laborHoursPerBuild: delivered > 0 ? sums.laborCentihours / 100 / delivered : null,
    jobMix,
    claimsOpened: sums.claimsOpened,
    claimsPer100Builds: delivered > 0 ? (sums.claimsOpened * 100) / delivered : null,
    warrantyCostCents: sums.warrantyCostCents,
    warrantyCostShare: sums.revenueCents > 0 ? sums.warrantyCostCents / sums.revenueCents : null,
    vendorCreditsReceivedCents: sums.creditsReceivedCents,
  };
  if (!reads.prices) for (const field of PRICE_FIGURES) delete figures[field];
  if (!reads.costs) for (const field of COST_FIGURES) delete figures[field];
  return figures;
}

export const noSums = (): RollupSums => Object.fromEntries(SUM_FIELDS.map((f) => [f, 0])) as unknown as RollupSums;

/** Adds `more` into `into` (sums and job mix). */
export function addInto(into: { sums: RollupSums; jobMix: JobMix }, more: { sums: RollupSums; jobMix: JobMix }): void {
  for (const field of SUM_FIELDS) into.sums[field] += more.sums[field];
  for (const [category, builds] of Object.entries(more.jobMix) as [Category, number][]) into.jobMix[category] = (into.jobMix[category] ?? 0) + builds;
}

/** Whether a location's period holds anything at all. */
export const isEmpty = (cell: { sums: RollupSums; jobMix: JobMix }) => SUM_FIELDS.every((f) => cell.sums[f] === 0) && Object.keys(cell.jobMix).length === 0;
