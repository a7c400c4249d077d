import { z } from 'zod';
import { idSchema } from './common.ts';
import { monthSchema } from './rollups.ts';

/** One month (YYYY-MM) of the person's locations, or of one shop or region of them. */
export const closeQuery = z.strictObject({ month: monthSchema, locationId: idSchema.optional(), regionId: idSchema.optional() });
export type CloseQuery = z.infer<typeof closeQuery>;

/**
 * A location's month as the accountant closes it, each day cut in the location's time zone. Builds
 * delivered in the month: revenue split into parts and labor, parts cost, gross margin. Warranty
 * claims logged in the month: credit asked of vendors, received, and still outstanding (asked, not
 * received, not denied). Royalty and marketing fund: the royalty base (the revenue of the delivered
 * builds: parts and labor; Busbar charges no sales tax) × the rates of the location's royalty terms
 * in force that month, each rounded to the cent.
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
}

export interface MonthClose {
  month: string;
  /** Whether the month has ended at every listed location (a month still running is a preview). */
  ended: boolean;
  /** The rates of the terms in force that month; null where the owner has set none (nothing is due then). */
  locations: (MonthCloseFigures & { locationId: number; royaltyBasisPoints: number | null; marketingBasisPoints: number | null })[];
  total: MonthCloseFigures;
}
