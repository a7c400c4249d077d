import { z } from 'zod';
import { idSchema } from './common.ts';
import { monthSchema, monthsBetween } from './rollups.ts';

/** One month (YYYY-MM) of the person's locations, or of one shop or region of them. */
export const closeQuery = z.strictObject({ month: monthSchema, locationId: idSchema.optional(), regionId: idSchema.optional() });
export type CloseQuery = z.infer<typeof closeQuery>;

/**
 * A location's month as the accountant closes it, each day cut in the location's time zone. Builds
 * delivered in the month: revenue split into parts and labor, parts cost, gross margin. Warranty
 * claims logged in the month: credit asked of vendors, received, and still outstanding (asked, not
 * received, not denied). Royalty and marketing fund: the royalty base (the revenue of the delivered
 * builds: parts and labor, sales tax apart) × the rates of the location's royalty terms in force
 * that month, each rounded to the cent. Sales tax collected: the location's rate in force that month
 * × the delivered builds' parts, and their labor where the rate taxes labor, rounded to the cent.
 */
export interface MonthCloseFigures {
  buildsDelivered: number;
  partsRevenueCents: number;
  laborRevenueCents: number;
  revenueCents: number;
  partsCostCents: number;
  grossMarginCents: number;
  claimsLogged: number;
  creditRequestedCents: number;
  creditReceivedCents: number;
  creditOutstandingCents: number;
  royaltyBaseCents: number;
  royaltyDueCents: number;
  marketingDueCents: number;
  salesTaxCents: number;
}

/**
 * Changes to months already final at a location, shown once, in the next month to close there:
 * what those months' delivered builds and credits received add up to now, less what was closed
 * (royalty and marketing fund at each month's own rates).
 */
export interface CloseAdjustments {
  /** The final months whose figures changed since they were last accounted for. */
  months: string[];
  buildsDelivered: number;
  revenueCents: number;
  partsCostCents: number;
  grossMarginCents: number;
  royaltyDueCents: number;
  marketingDueCents: number;
  creditReceivedCents: number;
}

/** A location's month: open (its figures follow every change), or final (as it was closed, never changed again). */
export interface LocationClose extends MonthCloseFigures {
  locationId: number;
  /** The rates of the terms in force that month; null where the owner has set none (nothing is due then). */
  royaltyBasisPoints: number | null;
  marketingBasisPoints: number | null;
  /** The sales tax rate in force that month and whether it taxes labor; null where the owner has set none (no sales tax). */
  salesTaxBasisPoints: number | null;
  laborTaxed: boolean | null;
  status: 'open' | 'final';
  finalizedAt: string | null;
  finalizedByName: string | null;
  /** Whether this is the next month to close there: the month after its last final one (any month while none is final). */
  next: boolean;
  /** The next month to close there; null while none is final. */
  nextToClose: string | null;
  /** Changes to earlier final months this month takes up (on the next month to close, or as it was closed); null when none. */
  adjustments: CloseAdjustments | null;
}

export interface MonthClose {
  month: string;
  /** Whether the month has ended at every listed location (a month still running is a preview). */
  ended: boolean;
  locations: LocationClose[];
  /** The listed locations' own figures added up (adjustments apart). */
  total: MonthCloseFigures;
}

export const closeParams = z.strictObject({ locationId: idSchema, month: monthSchema });

/** The most months one close status grid covers. */
export const MAX_STATUS_MONTHS = 24;

/** The close status of months from `from` to `to` (inclusive) at the person's locations, or at one shop or region of them. */
export const closeStatusQuery = z
  .strictObject({ from: monthSchema, to: monthSchema, locationId: idSchema.optional(), regionId: idSchema.optional() })
  // Only two well-formed months are compared: a malformed one is answered on its own field alone.
  .refine((q) => q.from <= q.to, { path: ['to'], message: 'Pick a last month on or after the first', when: (p) => p.issues.length === 0 })
  .refine((q) => monthsBetween(q.from, q.to) <= MAX_STATUS_MONTHS, { path: ['to'], message: `Pick at most ${MAX_STATUS_MONTHS} months`, when: (p) => p.issues.length === 0 });
export type CloseStatusQuery = z.infer<typeof closeStatusQuery>;

/**
 * A location's month: final (marked so), running (not yet ended in the location's time zone), next
 * (the next to close there: the month after its last final one, or any ended month while none is
 * final), or open (ended, and not the next).
 */
export type CloseCellStatus = 'final' | 'next' | 'open' | 'running';

/** Each location's months, in the order of `months`. */
export interface CloseStatus {
  months: string[];
  locations: { locationId: number; cells: CloseCellStatus[] }[];
}
