import type { Generated } from 'kysely';

export interface LocationsTable {
  id: Generated<number>;
  regionId: number;
  code: string;
  name: string;
  /** IANA time zone; periods (day, week, month) are cut in this zone. */
  timeZone: string;
  laborRateCents: number;
  /** Claims whose credit is above this a location lead may not approve alone (the regional manager does). */
  claimApprovalLimitCents: Generated<number>;
}

/** Royalty and marketing-fund rates of a location from a month on (migration 025), set by the owner. */
export interface RoyaltyTermsTable {
  id: Generated<number>;
  locationId: number;
  /** The first month (YYYY-MM) these terms apply to; they hold until the next terms' month. */
  appliesFrom: string;
  /** Of the royalty base, in basis points (650 = 6.5 %). */
  royaltyBasisPoints: number;
  marketingBasisPoints: number;
  createdBy: number | null;
  createdAt: string;
}

/** A location's sales tax rate from a month on (migration 029), set by the owner; none set: no sales tax. */
export interface SalesTaxRatesTable {
  id: Generated<number>;
  locationId: number;
  /** The first month (YYYY-MM) the rate applies to; it holds until the next rate's month. */
  appliesFrom: string;
  /** Of the taxable sales, in basis points (825 = 8.25 %). */
  basisPoints: number;
  /** 1 where labor is taxed as well as parts, else 0. */
  laborTaxed: number;
  createdBy: number | null;
  createdAt: string;
}

/** A location's month marked final (migration 026); `figures` and `carried` are JSON. */
export interface MonthClosesTable {
  locationId: number;
  month: string;
  finalizedAt: string;
  finalizedBy: number | null;
  /** The month's close as marked final (MonthCloseFigures with its rates and the adjustments it carried). */
  figures: string;
  /** The month's builds, revenue, parts cost and credits received as accounted for so far (CarriedFigures). */
  carried: string;
  /** 1 once the month's roll-up changed after it was last accounted for (migration 055), until the shop's next close takes it up. */
  changed: Generated<number>;
}

/** What a month's close adds up, per month (YYYY-MM, in the location's zone) and location, kept by triggers (migration 056). */
export interface MonthCloseSumsTable {
  month: string;
  locationId: number;
  /** Builds delivered on a day of the month, and their parts, labor and total price and parts cost. */
  buildsDelivered: number;
  partsRevenueCents: number;
  laborRevenueCents: number;
  revenueCents: number;
  partsCostCents: number;
  /** Claims logged on a day of the month, the credit they asked, received, and asked and still awaited (not denied). */
  claimsLogged: number;
  creditRequestedCents: number;
  creditReceivedCents: number;
  creditOutstandingCents: number;
}
