import { z } from 'zod';
import { CATEGORIES, type Category } from './catalog.ts';
import type { Coverage, FailureMode } from './claims.ts';

/** What the reliability figures are gathered by. */
export const RELIABILITY_GROUPS = ['item', 'category', 'vendor'] as const;
export type ReliabilityGroup = (typeof RELIABILITY_GROUPS)[number];

/** Unit-months are counted in months of this many days (365.25 / 12). */
export const DAYS_PER_MONTH = 30.4375;
/** Failure rates are per this many unit-months. */
export const RATE_PER_UNIT_MONTHS = 1_000;
/** The most locations one request names; more than that is the whole network or a region. */
export const MAX_RELIABILITY_LOCATIONS = 500;

const month = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'Pick a month');
const locationList = z
  .string()
  .max(4_000)
  .transform((text, ctx) => {
    const ids = text.split(',').filter(Boolean).map(Number);
    if (ids.some((id) => !Number.isInteger(id) || id <= 0)) ctx.addIssue({ code: 'custom', message: 'Pick locations from the list' });
    if (ids.length > MAX_RELIABILITY_LOCATIONS) ctx.addIssue({ code: 'custom', message: `Pick at most ${MAX_RELIABILITY_LOCATIONS} locations` });
    return [...new Set(ids)];
  });

/** Units installed from and to these months (inclusive), at these locations (all the person sees when absent). */
const filters = {
  from: month.optional(),
  to: month.optional(),
  locationIds: locationList.optional(),
};
const monthRange = (q: { from?: string; to?: string }) => !q.from || !q.to || q.from <= q.to;

export const reliabilityQuery = z
  .strictObject({ groupBy: z.enum(RELIABILITY_GROUPS, { error: 'Pick items, categories or vendors' }).default('item'), ...filters })
  .refine(monthRange, { path: ['to'], message: 'Pick a month on or after the first' });
export type ReliabilityQuery = z.infer<typeof reliabilityQuery>;

export const reliabilityDetailQuery = z.strictObject(filters).refine(monthRange, { path: ['to'], message: 'Pick a month on or after the first' });
export type ReliabilityDetailQuery = z.infer<typeof reliabilityDetailQuery>;

/** A catalog item or vendor by id, a category by name. */
const keyOf = (what: string) => z.coerce.number().int().positive().catch(0).refine((id) => id > 0, `Pick ${what} from the list`);
export const reliabilityDetailParams = z.discriminatedUnion(
  'groupBy',
  [
    z.strictObject({ groupBy: z.literal('item'), key: keyOf('an item') }),
    z.strictObject({ groupBy: z.literal('vendor'), key: keyOf('a vendor') }),
    z.strictObject({ groupBy: z.literal('category'), key: z.enum(CATEGORIES, { error: 'Pick a category from the list' }) }),
  ],
  { error: 'Pick items, categories or vendors' },
);
export type ReliabilityDetailParams = z.infer<typeof reliabilityDetailParams>;

export interface Interval {
  estimate: number;
  lower: number;
  upper: number;
}

/** The figures of one item, category or vendor over the chosen months and locations. */
export interface ReliabilityFigures {
  units: number;
  unitMonths: number;
  failures: number;
  /** Failures per RATE_PER_UNIT_MONTHS unit-months, with exact Poisson limits; null with no time in service. */
  rate: Interval | null;
  /**
   * The share of units that failed within their warranty, among units installed long enough ago
   * for their whole warranty to have passed, with its Wilson interval; null when none has.
   */
  warranty: (Interval & { failures: number; units: number }) | null;
}

export interface ReliabilityRow extends ReliabilityFigures {
  key: string;
  label: string;
  category: Category | null;
  /** The same group's rate across the whole network, for comparison. */
  networkRate: Interval | null;
}

/** An item, or the units of it installed in one quarter, failing more than its peers; ranked by how unlikely its count is by chance. */
export interface WatchRow {
  key: string;
  label: string;
  /** The install months of a quarter's units (YYYY-MM, inclusive); null for the item as a whole. */
  from: string | null;
  to: string | null;
  failures: number;
  /** Failures expected at the rate of the other items of its category across the network, installed in the same quarters. */
  expected: number;
  /** Chance of this many failures or more if it failed like its peers (one-sided Poisson). */
  chance: number;
  /** Its rate over the peers' rate, and the lower 95 % limit of that ratio (its exact Poisson limit over the peers' rate). */
  ratio: number;
  ratioLower: number;
  reason: string;
}

export interface ReliabilityList {
  asOf: string;
  groupBy: ReliabilityGroup;
  rows: ReliabilityRow[];
  watch: WatchRow[];
}

/** Read from the likelihood-ratio test of a steady rate (Weibull shape 1) at 95 %. */
export const WEIBULL_READINGS = ['early', 'steady', 'wear_out'] as const;
export type WeibullReading = (typeof WEIBULL_READINGS)[number];
export const WEIBULL_READING_LABELS: Record<WeibullReading, string> = {
  early: 'Early failures: the hazard falls with age (often installation or a bad batch)',
  steady: 'No clear change with age: as far as these failures show, they come at a steady rate',
  wear_out: 'Wear-out: the hazard rises with age',
};

/** Where a location's rate lies against the network's funnel limits. */
export const FUNNEL_SIGNALS = ['above_998', 'above_95', 'within', 'below_95', 'below_998'] as const;
export type FunnelSignal = (typeof FUNNEL_SIGNALS)[number];
export const FUNNEL_SIGNAL_LABELS: Record<FunnelSignal, string> = {
  above_998: 'Above the 99.8 % limit',
  above_95: 'Above the 95 % limit',
  within: 'Within the limits',
  below_95: 'Below the 95 % limit',
  below_998: 'Below the 99.8 % limit',
};

/** One location on the funnel; another shop the person may not see has no id, code or name. */
export interface FunnelPoint {
  locationId: number | null;
  code: string | null;
  name: string | null;
  unitMonths: number;
  failures: number;
  /** Per RATE_PER_UNIT_MONTHS unit-months. */
  rate: number;
  signal: FunnelSignal;
  /** Claims at the location for this item, category or vendor, and how many were the shop's workmanship. */
  claims: number;
  workmanshipClaims: number;
}

/** The funnel's limits at one exposure, per RATE_PER_UNIT_MONTHS unit-months. */
export interface FunnelLimit {
  unitMonths: number;
  lower998: number;
  lower95: number;
  upper95: number;
  upper998: number;
}

/** The survival curve at the last failure of a week of service: the units in service at the week's first failure, and the week's failures. */
export interface SurvivalPoint {
  /** Months in service. */
  months: number;
  atRisk: number;
  failures: number;
  survival: number;
  lower: number;
  upper: number;
}

export const MARGIN_MEASURES = ['drop', 'load', 'discharge'] as const;
export type MarginMeasure = (typeof MARGIN_MEASURES)[number];
export const MARGIN_MEASURE_LABELS: Record<MarginMeasure, string> = {
  drop: "Tightest circuit's voltage drop against its limit",
  load: "Tightest circuit's current against its conductor's ampacity",
  discharge: "The house bank's deepest discharge on the planned trip",
};
/** Bands 1–4 of each measure, from the most margin to past the limit. */
export const MARGIN_BAND_LABELS: Record<MarginMeasure, readonly [string, string, string, string]> = {
  drop: ['Under 50 % of the limit', '50–80 %', '80–100 %', 'Over the limit'],
  load: ['Under 50 % of ampacity', '50–80 %', '80–100 %', 'Over ampacity'],
  discharge: ['Under 30 %', '30–50 %', '50–80 %', 'Over 80 %'],
};

export interface MarginRow extends ReliabilityFigures {
  measure: MarginMeasure;
  band: 1 | 2 | 3 | 4;
}

export interface ReliabilityDetail {
  asOf: string;
  groupBy: ReliabilityGroup;
  key: string;
  label: string;
  category: Category | null;
  figures: ReliabilityFigures;
  /** The same over every location of the network, for comparison. */
  network: ReliabilityFigures;
  survival: SurvivalPoint[];
  weibull: { shape: number; scaleMonths: number; reading: WeibullReading } | null;
  /** Why there is no Weibull fit, when there is none. */
  weibullNote: string | null;
  failureModes: { mode: FailureMode; claims: number }[];
  coverages: { coverage: Coverage; claims: number }[];
  funnel: { points: FunnelPoint[]; limits: FunnelLimit[] };
  margins: MarginRow[];
  /** Units on builds with a power plan, of all units counted. */
  plannedUnits: number;
}
