import { z } from 'zod';
import { periodCount, ROLLUP_GRAINS } from '../rollup-periods.ts';
import type { Category } from './catalog.ts';

/** The most periods one roll-up request covers. */
export const MAX_ROLLUP_PERIODS = 400;

const day = z.iso.date('Use a date like 2026-03-31');

/** Every period that holds a day from `from` to `to` (inclusive), each cut in its location's zone. */
export const rollupQuery = z
  .strictObject({
    from: day,
    to: day,
    grain: z.enum(ROLLUP_GRAINS, { error: 'Pick day, week, month, quarter or year' }),
  })
  .refine((q) => q.from <= q.to, { path: ['to'], message: 'Pick an end on or after the start' })
  .refine((q) => q.from > q.to || periodCount(q.grain, q.from, q.to) <= MAX_ROLLUP_PERIODS, {
    path: ['to'],
    message: `Pick at most ${MAX_ROLLUP_PERIODS} periods: a shorter range or a longer period`,
  });
export type RollupQuery = z.infer<typeof rollupQuery>;

/**
 * The figures of one period. Money fields are left out for people who may not read build prices
 * (revenue, ticket, warranty cost, credits) or costs (parts cost, gross margin) there. A ratio
 * over no delivered builds (or no revenue) is null.
 */
export interface RollupFigures {
  buildsDelivered: number;
  /** Builds booked for a day of the period and not cancelled. */
  buildsBooked: number;
  /** Total of the delivered builds. */
  revenueCents?: number;
  partsCostCents?: number;
  /** Revenue less parts cost. */
  grossMarginCents?: number;
  laborHours: number;
  averageTicketCents?: number | null;
  laborHoursPerBuild: number | null;
  /** Delivered builds with at least one component of each category. */
  jobMix: Partial<Record<Category, number>>;
  claimsOpened: number;
  claimsPer100Builds: number | null;
  /** Claim labor at the build's rate plus credit asked of the vendor and not received, of the claims logged in the period. */
  warrantyCostCents?: number;
  /** Warranty cost over revenue (0.02 is 2 %). */
  warrantyCostShare?: number | null;
  /** Vendor credit received on the claims logged in the period. */
  vendorCreditsReceivedCents?: number;
}

/** One asked period, with the keys of the period before it and of the same period a year before. */
export interface RollupPeriod {
  period: string;
  start: string;
  end: string;
  previous: string;
  lastYear: string;
}

/**
 * Roll-ups of the person's scope. `rows`, `regions` and `network` hold every asked period and
 * every `previous` and `lastYear` one; a location or region with nothing in a period has no row.
 * Regions are those wholly in the person's scope; the network is every location.
 */
export interface Rollups {
  grain: (typeof ROLLUP_GRAINS)[number];
  periods: RollupPeriod[];
  rows: (RollupFigures & { locationId: number; period: string })[];
  regions: (RollupFigures & { regionId: number; period: string })[];
  network: (RollupFigures & { period: string })[];
}
