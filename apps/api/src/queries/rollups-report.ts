import type { Db } from '@busbar/db';
import { PERIODS_A_YEAR, periodEnd, periodKey, periodNumber, periodStart, type RollupQuery, type Rollups } from '@busbar/shared';
import { locationScope, type LocationScope } from '../access/locations.ts';
import type { Viewer } from '../access/viewer.ts';
import { invalidField } from '../errors.ts';
import { addInto, figuresOf, isEmpty, noSums, numbers, type MoneyReads } from './rollups-figures.ts';
import { locationRegions, locationSums, networkSums, type RollupSums } from './rollups.ts';

/** The asked periods with the keys of the period before each and of the same period a year before. */
export function askedPeriods({ grain, from, to }: RollupQuery) {
  const periods: Rollups['periods'] = [];
  for (let n = periodNumber(grain, from); n <= periodNumber(grain, to); n++) {
    periods.push({ period: periodKey(grain, n), start: periodStart(grain, n), end: periodEnd(grain, n), previous: periodKey(grain, n - 1), lastYear: periodKey(grain, n - PERIODS_A_YEAR[grain]) });
  }
  return periods;
}

/** The most location-periods one answer holds (a year by week for 200 locations is about 21,000). */
export const MAX_ROLLUP_ROWS = 25_000;

/** Refuses an answer of more than `MAX_ROLLUP_ROWS` location-periods, in words. */
export function checkAnswerSize(locations: number, periods: number): void {
  if (locations * periods > MAX_ROLLUP_ROWS) {
    throw invalidField('to', `That is ${periods} periods (with those compared) for each of ${locations} locations: pick a shorter range or a longer period`);
  }
}

/**
 * Roll-ups of the locations in `scope` (never empty), of each region wholly in it, and of the whole
 * network, for the asked periods and the ones they are compared with.
 */
export async function rollupReport(db: Db, query: RollupQuery, scope: LocationScope, money: MoneyScopes): Promise<Rollups> {
  const { grain } = query;
  const periods = askedPeriods(query);
  const keys = [...new Set(periods.flatMap((p) => [p.period, p.previous, p.lastYear]))];
  const locations = await locationRegions(db);
  checkAnswerSize(scope === 'all' ? locations.length : scope.length, keys.length);
  const rows = await locationSums(db, grain, keys, scope);
  const kept = rows.filter((row) => !isEmpty(row));
  // Someone who sees every location has the network's sums in their rows already.
  const network = scope === 'all' ? sumsByPeriod(kept) : (await networkSums(db, grain, keys)).map((row) => ({ period: row.period, sums: numbers(row) }));

  const reads = moneyReads(money);
  const inScope = scope === 'all' ? null : new Set(scope);
  const regionOf = new Map(locations.map((l) => [l.id, l.regionId]));
  const whole = new Set(locations.map((l) => l.regionId).filter((r) => locations.every((l) => l.regionId !== r || !inScope || inScope.has(l.id))));
  const regions = new Map<string, { regionId: number; period: string; sums: RollupSums }>();
  for (const row of kept) {
    const regionId = regionOf.get(row.locationId)!;
    if (!whole.has(regionId)) continue;
    const key = `${regionId} ${row.period}`;
    if (!regions.has(key)) regions.set(key, { regionId, period: row.period, sums: noSums() });
    addInto(regions.get(key)!.sums, row);
  }
  const regionLocations = (regionId: number) => locations.filter((l) => l.regionId === regionId).map((l) => l.id);
  const scopeIds = scope === 'all' ? locations.map((l) => l.id) : scope;
  return {
    grain,
    periods,
    rows: kept.map((row) => figuresOf({ locationId: row.locationId, period: row.period }, row, reads([row.locationId]))),
    regions: [...regions.values()].map((r) => figuresOf({ regionId: r.regionId, period: r.period }, r.sums, reads(regionLocations(r.regionId)))),
    network: network
      .filter((n) => !isEmpty(n.sums))
      .map((n) => figuresOf({ period: n.period }, n.sums, reads(scopeIds))),
  };
}

function sumsByPeriod(rows: (RollupSums & { period: string })[]) {
  const periods = new Map<string, RollupSums>();
  for (const row of rows) {
    if (!periods.has(row.period)) periods.set(row.period, noSums());
    addInto(periods.get(row.period)!, row);
  }
  return [...periods].map(([period, sums]) => ({ period, sums }));
}

/** Where a person reads prices and where parts costs, by the role rules. */
export interface MoneyScopes {
  prices: LocationScope;
  costs: LocationScope;
}

export function moneyScopes(viewer: Viewer): MoneyScopes {
  return { prices: locationScope(viewer, 'read', 'Build', 'totalCents'), costs: locationScope(viewer, 'read', 'Build', 'partsCostCents') };
}

/** Money a person reads over some locations: only what the role rules let them read at every one of them. */
export function moneyReads({ prices, costs }: MoneyScopes): (locationIds: number[]) => MoneyReads {
  const everywhere = (scope: LocationScope, ids: number[]) => scope === 'all' || ids.every((id) => scope.includes(id));
  return (ids) => ({ prices: everywhere(prices, ids), costs: everywhere(costs, ids) });
}
