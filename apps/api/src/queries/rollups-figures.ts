import { CATEGORIES, type RollupFigures } from '@busbar/shared';
import { mixColumn, SUM_FIELDS, type RollupSums } from './rollups.ts';

/** Which money a person reads where the figures come from: build prices, build costs. */
export interface MoneyReads {
  prices: boolean;
  costs: boolean;
}

const PRICE_FIGURES = ['revenueCents', 'grossMarginCents', 'averageTicketCents', 'warrantyCostCents', 'warrantyCostShare', 'vendorCreditsReceivedCents'] as const;
const COST_FIGURES = ['partsCostCents', 'grossMarginCents'] as const;
const MIX = CATEGORIES.map((category) => [category, mixColumn(category)] as const);

/**
 * The figures of a period made from its sums, after `head` (its location or region and period),
 * without the money the person may not read. One object literal, then `head` assigned in: a spread
 * into a literal is many times slower over thousands of rows.
 */
export function figuresOf<H extends object>(head: H, sums: RollupSums, reads: MoneyReads): H & RollupFigures {
  const delivered = sums.buildsDelivered;
  const jobMix: RollupFigures['jobMix'] = {};
  for (const [category, column] of MIX) if (sums[column] !== 0) jobMix[category] = sums[column];
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
  return Object.assign(head, figures);
}

export const noSums = (): RollupSums => Object.fromEntries(SUM_FIELDS.map((f) => [f, 0])) as unknown as RollupSums;

/** Adds `more` into `into`. */
export function addInto(into: RollupSums, more: RollupSums): void {
  for (const field of SUM_FIELDS) into[field] += more[field];
}

/** Whether a period holds nothing at all (a row whose builds and claims were all taken out again). */
export const isEmpty = (sums: RollupSums) => SUM_FIELDS.every((f) => sums[f] === 0);

/** SQLite answers sums as numbers already; PostgreSQL would answer bigint sums as text. */
export const numbers = (row: RollupSums): RollupSums => Object.fromEntries(SUM_FIELDS.map((f) => [f, Number(row[f])])) as unknown as RollupSums;
