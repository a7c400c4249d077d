import type { Db } from '@busbar/db';
import type { LocationClose, MonthCloseFigures } from '@busbar/shared';
import { sql } from 'kysely';
import type { LocationScope } from '../access/locations.ts';

export const FIGURES = [
  'buildsDelivered', 'partsRevenueCents', 'laborRevenueCents', 'revenueCents', 'partsCostCents', 'grossMarginCents',
  'claimsLogged', 'creditRequestedCents', 'creditReceivedCents', 'creditOutstandingCents', 'royaltyBaseCents', 'royaltyDueCents', 'marketingDueCents', 'salesTaxCents',
] as const satisfies readonly (keyof MonthCloseFigures)[];

/** Royalty (marketing fund, sales tax) in cents of `baseCents` at `basisPoints` (650 = 6.5 %), half a cent and up rounded up. */
export const royaltyCents = (baseCents: number, basisPoints: number) => Math.round((baseCents * basisPoints) / 10_000);

/** A location's month as its builds and claims add up now, with the rates of its terms. */
export type LiveClose = Omit<LocationClose, 'status' | 'finalizedAt' | 'finalizedByName' | 'next' | 'nextToClose' | 'adjustments'>;

/**
 * The month (YYYY-MM) at each location of `scope` (see MonthCloseFigures) as it stands now: the
 * builds delivered and the claims logged on the month's days at the location (by the day columns
 * kept in each location's zone), as their sums are kept per month (migration 056).
 */
export async function liveCloses(db: Db, month: string, scope: LocationScope): Promise<LiveClose[]> {
  let query = db
    .selectFrom('locations as l')
    .leftJoin('monthCloseSums as k', (join) => join.onRef('k.locationId', '=', 'l.id').on('k.month', '=', month))
    // The terms in force that month: the latest that apply from it or before.
    .leftJoin('royaltyTerms as t', (join) =>
      join.onRef('t.locationId', '=', 'l.id').on(sql.ref('t.appliesFrom'), '=', sql`(select max(u.applies_from) from royalty_terms u where u.location_id = l.id and u.applies_from <= ${month})`),
    )
    // Likewise the sales tax rate in force that month.
    .leftJoin('salesTaxRates as s', (join) =>
      join.onRef('s.locationId', '=', 'l.id').on(sql.ref('s.appliesFrom'), '=', sql`(select max(v.applies_from) from sales_tax_rates v where v.location_id = l.id and v.applies_from <= ${month})`),
    )
    .select([
      'l.id', 't.royaltyBasisPoints', 't.marketingBasisPoints', 's.basisPoints as taxBasisPoints', 's.laborTaxed',
      'k.buildsDelivered', 'k.partsRevenueCents', 'k.laborRevenueCents', 'k.revenueCents', 'k.partsCostCents',
      'k.claimsLogged', 'k.creditRequestedCents', 'k.creditReceivedCents', 'k.creditOutstandingCents',
    ])
    .orderBy('l.code');
  if (scope !== 'all') query = query.where('l.id', 'in', scope.length > 0 ? scope : [0]);
  const rows = await query.execute();

  return rows.map((r) => {
    // A location with nothing delivered or logged in the month may have no kept row: all its sums are 0.
    const revenue = r.revenueCents ?? 0;
    const [parts, labor, cost] = [r.partsRevenueCents ?? 0, r.laborRevenueCents ?? 0, r.partsCostCents ?? 0];
    // A location without terms (none set yet) owes nothing until the owner sets them; the screen says so.
    const [royaltyBasisPoints, marketingBasisPoints] = [r.royaltyBasisPoints ?? null, r.marketingBasisPoints ?? null];
    // Likewise a location without a sales tax rate charges none.
    const laborTaxed = r.laborTaxed === null ? null : r.laborTaxed === 1;
    return {
      locationId: r.id,
      royaltyBasisPoints,
      marketingBasisPoints,
      salesTaxBasisPoints: r.taxBasisPoints,
      laborTaxed,
      buildsDelivered: r.buildsDelivered ?? 0,
      partsRevenueCents: parts,
      laborRevenueCents: labor,
      revenueCents: revenue,
      partsCostCents: cost,
      grossMarginCents: revenue - cost,
      claimsLogged: r.claimsLogged ?? 0,
      creditRequestedCents: r.creditRequestedCents ?? 0,
      creditReceivedCents: r.creditReceivedCents ?? 0,
      creditOutstandingCents: r.creditOutstandingCents ?? 0,
      royaltyBaseCents: revenue,
      royaltyDueCents: royaltyCents(revenue, royaltyBasisPoints ?? 0),
      marketingDueCents: royaltyCents(revenue, marketingBasisPoints ?? 0),
      salesTaxCents: royaltyCents(parts + (laborTaxed ? labor : 0), r.taxBasisPoints ?? 0),
    };
  });
}
