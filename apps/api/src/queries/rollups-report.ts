import type { Db } from '@busbar/db';
import { PERIODS_A_YEAR, periodEnd, periodKey, periodNumber, periodStart, type Category, type RollupQuery, type Rollups } from '@busbar/shared';
import { locationScope, type LocationScope } from '../access/locations.ts';
import type { Viewer } from '../access/viewer.ts';
import { addInto, figuresOf, isEmpty, noSums, type JobMix, type MoneyReads } from './rollups-figures.ts';
import { locationJobMix, locationRegions, locationSums, networkJobMix, networkSums, type RollupSums } from './rollups.ts';

type Cell = { sums: RollupSums; jobMix: JobMix };

/** The asked periods with the keys of the period before each and of the same period a year before. */
export function askedPeriods({ grain, from, to }: RollupQuery) {
  const periods: Rollups['periods'] = [];
  for (let n = periodNumber(grain, from); n <= periodNumber(grain, to); n++) {
    periods.push({ period: periodKey(grain, n), start: periodStart(grain, n), end: periodEnd(grain, n), previous: periodKey(grain, n - 1), lastYear: periodKey(grain, n - PERIODS_A_YEAR[grain]) });
  }
  return periods;
}

/**
 * Roll-ups of the locations in `scope` (never empty), each location's and each region's wholly in
 * it, and the whole network's, for the asked periods and the ones they are compared with.
 */
export async function rollupReport(db: Db, viewer: Viewer, query: RollupQuery, scope: LocationScope): Promise<Rollups> {
  const { grain } = query;
  const periods = askedPeriods(query);
  const keys = [...new Set(periods.flatMap((p) => [p.period, p.previous, p.lastYear]))];
  const [sums, mix, network, networkMix, locations] = await Promise.all([
    locationSums(db, grain, keys, scope),
    locationJobMix(db, grain, keys, scope),
    networkSums(db, grain, keys),
    networkJobMix(db, grain, keys),
    locationRegions(db),
  ]);
  const cells = new Map<string, Cell & { locationId: number; period: string }>();
  const cellOf = (locationId: number, period: string) => {
    const key = `${locationId} ${period}`;
    let cell = cells.get(key);
    if (!cell) cells.set(key, (cell = { locationId, period, sums: noSums(), jobMix: {} }));
    return cell;
  };
  for (const { locationId, period, ...row } of sums) cellOf(locationId, period).sums = row;
  for (const m of mix) cellOf(m.locationId, m.period).jobMix[m.category] = m.builds;
  const kept = [...cells.values()].filter((c) => !isEmpty(c));

  const reads = moneyReads(viewer);
  const inScope = scope === 'all' ? null : new Set(scope);
  const regionOf = new Map(locations.map((l) => [l.id, l.regionId]));
  const whole = new Set(locations.map((l) => l.regionId).filter((r) => locations.every((l) => l.regionId !== r || !inScope || inScope.has(l.id))));
  const regions = new Map<string, Cell & { regionId: number; period: string }>();
  for (const cell of kept) {
    const regionId = regionOf.get(cell.locationId)!;
    if (!whole.has(regionId)) continue;
    const key = `${regionId} ${cell.period}`;
    let region = regions.get(key);
    if (!region) regions.set(key, (region = { regionId, period: cell.period, sums: noSums(), jobMix: {} }));
    addInto(region, cell);
  }
  const regionLocations = (regionId: number) => locations.filter((l) => l.regionId === regionId).map((l) => l.id);
  const networkJobs = new Map<string, JobMix>();
  for (const m of networkMix) (networkJobs.get(m.period) ?? networkJobs.set(m.period, {}).get(m.period)!)[m.category as Category] = m.builds;
  const scopeIds = scope === 'all' ? locations.map((l) => l.id) : scope;
  return {
    grain,
    periods,
    rows: kept.map((c) => ({ locationId: c.locationId, period: c.period, ...figuresOf(c.sums, c.jobMix, reads([c.locationId])) })),
    regions: [...regions.values()].map((r) => ({ regionId: r.regionId, period: r.period, ...figuresOf(r.sums, r.jobMix, reads(regionLocations(r.regionId))) })),
    network: network
      .map(({ period, ...row }) => ({ period, sums: numbers(row), jobMix: networkJobs.get(period) ?? {} }))
      .filter((n) => !isEmpty(n))
      .map((n) => ({ period: n.period, ...figuresOf(n.sums, n.jobMix, reads(scopeIds)) })),
  };
}

/** SQLite answers sums as numbers already; PostgreSQL would answer bigint sums as text. */
const numbers = (row: RollupSums): RollupSums => Object.fromEntries(Object.entries(row).map(([k, v]) => [k, Number(v)])) as unknown as RollupSums;

/** Money a person reads over some locations: only what the role rules let them read at every one of them. */
function moneyReads(viewer: Viewer): (locationIds: number[]) => MoneyReads {
  const prices = locationScope(viewer, 'read', 'Build', 'totalCents');
  const costs = locationScope(viewer, 'read', 'Build', 'partsCostCents');
  const everywhere = (scope: LocationScope, ids: number[]) => scope === 'all' || ids.every((id) => scope.includes(id));
  return (ids) => ({ prices: everywhere(prices, ids), costs: everywhere(costs, ids) });
}
