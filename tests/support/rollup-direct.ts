import { isoDay, localDay } from '@busbar/calc';
import type { Db } from '@busbar/db';
import type { RollupFigures, RollupGrain } from '@busbar/shared';

// Roll-up figures worked out straight from builds, lines and claims, for comparing with the summary table.

/** The period key of a local day, worked out with Date rather than the tables' SQL. */
export function keyOf(grain: RollupGrain, day: string): string {
  const date = new Date(`${day}T00:00:00Z`);
  if (grain === 'day') return day;
  if (grain === 'week') return new Date(date.getTime() - ((date.getUTCDay() + 6) % 7) * 86_400_000).toISOString().slice(0, 10);
  if (grain === 'month') return day.slice(0, 7);
  if (grain === 'quarter') return `${day.slice(0, 4)}-Q${Math.floor(date.getUTCMonth() / 3) + 1}`;
  return day.slice(0, 4);
}

export const noDirect = (): Direct => ({ delivered: 0, booked: 0, revenue: 0, cost: 0, labor: 0, claims: 0, warranty: 0, credits: 0, mix: {} });

export interface Direct {
  delivered: number; booked: number; revenue: number; cost: number; labor: number; claims: number; warranty: number; credits: number; mix: Record<string, number>;
}

/** Every location's figures by period straight from builds, lines and claims, each day read in the location's zone from the UTC times. */
export async function direct(db: Db, grain: RollupGrain): Promise<Map<string, Direct>> {
  const zones = new Map((await db.selectFrom('locations').select(['id', 'timeZone']).execute()).map((l) => [l.id, l.timeZone]));
  const builds = await db.selectFrom('builds').selectAll().execute();
  const lines = await db.selectFrom('buildItems as i').innerJoin('catalogItems as c', 'c.id', 'i.catalogItemId').select(['i.buildId', 'c.category']).execute();
  const claims = await db.selectFrom('warrantyClaims').selectAll().execute();
  const out = new Map<string, Direct>();
  const at = (locationId: number, day: string) => {
    const key = `${locationId} ${keyOf(grain, day)}`;
    if (!out.has(key)) out.set(key, noDirect());
    return out.get(key)!;
  };
  const localOf = (locationId: number, iso: string) => isoDay(localDay(zones.get(locationId)!, Date.parse(iso)));
  for (const b of builds) {
    if (b.status === 'delivered') {
      const cell = at(b.locationId, localOf(b.locationId, b.deliveredAt!));
      cell.delivered++;
      cell.revenue += b.totalCents;
      cell.cost += b.partsCostCents;
      cell.labor += b.laborHours;
      for (const category of new Set(lines.filter((l) => l.buildId === b.id).map((l) => l.category))) cell.mix[category] = (cell.mix[category] ?? 0) + 1;
    }
    if (['booked', 'in_bay', 'quality_check', 'delivered'].includes(b.status) && b.bookedFor) at(b.locationId, b.bookedFor).booked++;
  }
  for (const c of claims) {
    const cell = at(c.locationId, localOf(c.locationId, c.createdAt));
    const rate = builds.find((b) => b.id === c.buildId)!.laborRateCents;
    cell.claims++;
    cell.warranty += Math.round(c.laborHours * rate) + Math.max(c.creditRequestedCents - (c.creditReceivedCents ?? 0), 0);
    cell.credits += c.creditReceivedCents ?? 0;
  }
  return out;
}

const ratio = (a: number, b: number) => (b > 0 ? a / b : null);
export const expectedFigures = (d: Direct): RollupFigures => ({
  buildsDelivered: d.delivered, buildsBooked: d.booked, revenueCents: d.revenue, partsCostCents: d.cost, grossMarginCents: d.revenue - d.cost,
  laborHours: d.labor, averageTicketCents: d.delivered > 0 ? Math.round(d.revenue / d.delivered) : null, laborHoursPerBuild: ratio(d.labor, d.delivered),
  jobMix: d.mix, claimsOpened: d.claims, claimsPer100Builds: ratio(d.claims * 100, d.delivered), warrantyCostCents: d.warranty,
  warrantyCostShare: ratio(d.warranty, d.revenue), vendorCreditsReceivedCents: d.credits,
});
