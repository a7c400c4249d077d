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
 * The month (YYYY-MM) at each location of `scope` (see MonthCloseFigures) as it stands now, from
 * the builds delivered and the claims logged on the month's days at the location, read by the day
 * columns kept in each location's zone.
 */
export async function liveCloses(db: Db, month: string, scope: LocationScope): Promise<LiveClose[]> {
  const [first, last] = [`${month}-01`, `${month}-31`];
  // The scope's ids for `in (…)`, which SQL allows no empty list of (read only when the scope is not the network).
  const inScope = scope === 'all' || scope.length === 0 ? [0] : scope;
  let query = db
    .selectFrom('locations as l')
    .leftJoin(
      (eb) =>
        // Each shop's month of delivered builds, one seek through their sums' index (migration 045), in shop order.
        eb
          .selectFrom('locations as bl')
          .innerJoin('builds', 'builds.locationId', 'bl.id')
          .where('builds.status', '=', 'delivered')
          .where('builds.deliveredOn', '>=', first)
          .where('builds.deliveredOn', '<=', last)
          .$if(scope !== 'all', (q) => q.where('bl.id', 'in', inScope))
          .groupBy('bl.id')
          .select(['bl.id as locationId', sql<number>`count(*)`.as('delivered'), sql<number>`sum(parts_price_cents)`.as('parts'), sql<number>`sum(labor_cents)`.as('labor'), sql<number>`sum(total_cents)`.as('revenue'), sql<number>`sum(parts_cost_cents)`.as('cost')])
          .as('b'),
      (join) => join.onRef('b.locationId', '=', 'l.id'),
    )
    .leftJoin(
      (eb) =>
        // Likewise each shop's claims logged in the month, through their sums' index (migration 047).
        eb
          .selectFrom('locations as cl')
          .innerJoin('warrantyClaims', 'warrantyClaims.locationId', 'cl.id')
          .where('warrantyClaims.loggedOn', '>=', first)
          .where('warrantyClaims.loggedOn', '<=', last)
          .$if(scope !== 'all', (q) => q.where('cl.id', 'in', inScope))
          .groupBy('cl.id')
          .select([
            'cl.id as locationId',
            sql<number>`count(*)`.as('claims'),
            sql<number>`sum(credit_requested_cents)`.as('requested'),
            sql<number>`sum(coalesce(credit_received_cents, 0))`.as('received'),
            sql<number>`sum(case when status <> 'denied' and credit_received_cents is null then credit_requested_cents else 0 end)`.as('outstanding'),
          ])
          .as('c'),
      (join) => join.onRef('c.locationId', '=', 'l.id'),
    )
    // The terms in force that month: the latest that apply from it or before.
    .leftJoin('royaltyTerms as t', (join) =>
      join.onRef('t.locationId', '=', 'l.id').on(sql.ref('t.appliesFrom'), '=', sql`(select max(u.applies_from) from royalty_terms u where u.location_id = l.id and u.applies_from <= ${month})`),
    )
    // Likewise the sales tax rate in force that month.
    .leftJoin('salesTaxRates as s', (join) =>
      join.onRef('s.locationId', '=', 'l.id').on(sql.ref('s.appliesFrom'), '=', sql`(select max(v.applies_from) from sales_tax_rates v where v.location_id = l.id and v.applies_from <= ${month})`),
    )
    .select(['l.id', 't.royaltyBasisPoints', 't.marketingBasisPoints', 's.basisPoints as taxBasisPoints', 's.laborTaxed', 'b.delivered', 'b.parts', 'b.labor', 'b.revenue', 'b.cost', 'c.claims', 'c.requested', 'c.received', 'c.outstanding'])
    .orderBy('l.code');
  if (scope !== 'all') query = query.where('l.id', 'in', inScope);
  const rows = await query.execute();

  return rows.map((r) => {
    const revenue = r.revenue ?? 0;
    // A location without terms (none set yet) owes nothing until the owner sets them; the screen says so.
    const [royaltyBasisPoints, marketingBasisPoints] = [r.royaltyBasisPoints ?? null, r.marketingBasisPoints ?? null];
    // Likewise a location without a sales tax rate charges none.
    const laborTaxed = r.laborTaxed === null ? null : r.laborTaxed === 1;
    const taxable = (r.parts ?? 0) + (laborTaxed ? (r.labor ?? 0) : 0);
    return {
      locationId: r.id,
      royaltyBasisPoints,
      marketingBasisPoints,
      salesTaxBasisPoints: r.taxBasisPoints,
      laborTaxed,
      buildsDelivered: r.delivered ?? 0,
      partsRevenueCents: r.parts ?? 0,
      laborRevenueCents: r.labor ?? 0,
      revenueCents: revenue,
      partsCostCents: r.cost ?? 0,
      grossMarginCents: revenue - (r.cost ?? 0),
      claimsLogged: r.claims ?? 0,
      creditRequestedCents: r.requested ?? 0,
      creditReceivedCents: r.received ?? 0,
      creditOutstandingCents: r.outstanding ?? 0,
      royaltyBaseCents: revenue,
      royaltyDueCents: royaltyCents(revenue, royaltyBasisPoints ?? 0),
      marketingDueCents: royaltyCents(revenue, marketingBasisPoints ?? 0),
      salesTaxCents: royaltyCents(taxable, r.taxBasisPoints ?? 0),
    };
  });
}
