import { z } from 'zod';
import { periodCount, ROLLUP_GRAINS } from '../rollup-periods.ts';
import type { Category } from './catalog.ts';
import { idSchema, pagingOf } from './common.ts';

/** The most periods one roll-up request covers. */
export const MAX_ROLLUP_PERIODS = 400;

const day = z.iso.date('Use a date like 2026-03-31');
/** One shop or the shops of one region of the person's (the scope chosen in the header); both must hold. */
const within = { locationId: idSchema.optional(), regionId: idSchema.optional() };

const rollupFields = {
  from: day,
  to: day,
  grain: z.enum(ROLLUP_GRAINS, { error: 'Pick day, week, month, quarter or year' }),
  /** `none`: no row per location, only the sums (a screen of totals need not fetch 5,000 rows of the network). */
  rows: z.enum(['each', 'none'], { error: 'Pick each or none' }).optional(),
  ...within,
};

/** A range of at most MAX_ROLLUP_PERIODS periods that ends on or after its start. */
const periodsRefined = <T extends z.ZodType<{ from: string; to: string; grain: (typeof ROLLUP_GRAINS)[number] }>>(schema: T) =>
  schema
    .refine((q) => q.from <= q.to, { path: ['to'], message: 'Pick an end on or after the start' })
    .refine((q) => q.from > q.to || periodCount(q.grain, q.from, q.to) <= MAX_ROLLUP_PERIODS, {
      path: ['to'],
      message: `Pick at most ${MAX_ROLLUP_PERIODS} periods: a shorter range or a longer period`,
    });

/** Every period that holds a day from `from` to `to` (inclusive), each cut in its location's zone. */
export const rollupQuery = periodsRefined(z.strictObject(rollupFields));
export type RollupQuery = z.infer<typeof rollupQuery>;

/** The most shops one page of roll-up rows holds, and a page's shops when not asked. */
export const MAX_ROLLUP_SHOPS_A_PAGE = 50;
export const ROLLUP_SHOPS_A_PAGE = 25;

/** The roll-ups as the API is asked for them: the rows of a page of the person's shops (by id), with every sum. */
export const rollupPageQuery = periodsRefined(z.strictObject({ ...rollupFields, ...pagingOf(MAX_ROLLUP_SHOPS_A_PAGE, ROLLUP_SHOPS_A_PAGE, ['shop', 'shops']) }));

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
 * Roll-ups of the person's scope. `rows` hold the shops of `locationIds` (a page of the person's
 * `total` shops, by id; none when the rows were not asked for); `rows`, `scope`, `regions` and
 * `network` hold every asked period and every `previous` and `lastYear` one; a location or region
 * with nothing in a period has no row. `scope` is the sum over every shop of the person's, not only
 * the page's. Regions are those wholly in the person's scope; the network is every location.
 */
export interface Rollups {
  grain: (typeof ROLLUP_GRAINS)[number];
  periods: RollupPeriod[];
  page: number;
  pageSize: number;
  /** The shops in the person's scope. */
  total: number;
  locationIds: number[];
  rows: (RollupFigures & { locationId: number; period: string })[];
  scope: (RollupFigures & { period: string })[];
  regions: (RollupFigures & { regionId: number; period: string })[];
  network: (RollupFigures & { period: string })[];
}

/** The most months one comparison of locations covers. */
export const MAX_COMPARED_MONTHS = 36;
export const monthSchema = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'Use a month like 2026-03');
/** How many months from `from` to `to`, both counted (2026-01 to 2026-03: 3). */
export const monthsBetween = (from: string, to: string) => (Number(to.slice(0, 4)) - Number(from.slice(0, 4))) * 12 + Number(to.slice(5)) - Number(from.slice(5)) + 1;

/** Whole months, from and to (inclusive), each cut in its location's zone. */
export const comparisonQuery = z
  .strictObject({ from: monthSchema, to: monthSchema, ...within })
  .refine((q) => q.from <= q.to, { path: ['to'], message: 'Pick an end on or after the start' })
  .refine((q) => q.from > q.to || monthsBetween(q.from, q.to) <= MAX_COMPARED_MONTHS, {
    path: ['to'],
    message: `Pick at most ${MAX_COMPARED_MONTHS} months`,
  });
export type ComparisonQuery = z.infer<typeof comparisonQuery>;

/** The figures locations are compared by; money follows the role rules as in RollupFigures. */
export const COMPARED_FIGURES = [
  'buildsDelivered',
  'revenueCents',
  'averageTicketCents',
  'grossMarginShare',
  'laborHoursPerBuild',
  'claimsPer100Builds',
  'warrantyCostShare',
] as const;
export type ComparedFigure = (typeof COMPARED_FIGURES)[number];
export type ComparedFigures = Partial<Record<ComparedFigure, number | null>> & { buildsDelivered: number; claimsOpened: number };

/**
 * Each location of the person's scope over the months, beside the median of every location of the
 * network that delivered a build in them. `outliers` names the figures that stand apart from the
 * network: claims per 100 builds outside the Poisson funnel at 99.8 %, the others by a modified
 * z-score beyond 3.5. A lead receives only their own location; the medians name no location.
 */
export interface LocationComparison {
  from: string;
  to: string;
  /** Locations of the network with a delivered build in the months, which the medians are taken over. */
  comparedLocations: number;
  median: ComparedFigures;
  locations: { locationId: number; figures: ComparedFigures; outliers: Partial<Record<ComparedFigure, 'high' | 'low'>> }[];
}
