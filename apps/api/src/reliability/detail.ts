import type { Db } from '@busbar/db';
import {
  COVERAGES,
  FAILURE_MODES,
  MARGIN_MEASURES,
  type MarginRow,
  type ReliabilityDetail,
  type ReliabilityDetailParams,
  type ReliabilityDetailQuery,
} from '@busbar/shared';
import type { LocationScope } from '../access/locations.ts';
import { notFound } from '../errors.ts';
import { serviceByLocation, unitSums, type UnitFilter } from '../queries/unit-exposure.ts';
import { claimShares, failureAges, itemsOf, workmanshipClaims } from '../queries/unit-failures.ts';
import { addSums, figuresOf, NO_UNITS } from './figures.ts';
import { funnelOf, type NamedLocation } from './funnel.ts';
import { catalogNames, labelOf } from './labels.ts';
import { observationsOf, survivalCurve, weibullOf } from './survival.ts';

/**
 * One item, category or vendor: its figures at the chosen locations beside the network's, the
 * survival curve and Weibull fit of those units, how they failed, every location on the funnel
 * (named where the person may see it: `visible`), and the failure rate by design-margin band.
 */
export async function reliabilityDetail(
  db: Db,
  params: ReliabilityDetailParams,
  selected: LocationScope,
  visible: LocationScope,
  query: ReliabilityDetailQuery,
  today: string,
  todayDay: number,
): Promise<ReliabilityDetail> {
  const names = await catalogNames(db);
  const label = labelOf(names, params.groupBy, params.key);
  if (!label) throw notFound(params.groupBy === 'vendor' ? 'vendor' : params.groupBy === 'item' ? 'catalog item' : 'category');
  const months = { from: query.from, to: query.to };
  const filter: UnitFilter = { group: params, scope: selected, ...months };
  const byMonth = await unitSums(db, filter, 'month', today);
  // The scope's sums are its months' added up; the network's are the same cells when the scope is the network.
  const selectedSums = addSums(byMonth);
  const networkSums = selected === 'all' ? selectedSums : ((await unitSums(db, { ...filter, scope: 'all' }, 'none', today))[0] ?? NO_UNITS);
  const failures = { itemIds: await itemsOf(db, params), ...months, scope: selected };
  const observations = observationsOf(await failureAges(db, failures), byMonth, todayDay);
  const shares = await claimShares(db, failures);
  const claimsOf = <K extends string>(key: 'failureMode' | 'coverage', values: readonly K[]) =>
    values.map((value) => ({ value, claims: shares.filter((s) => s[key] === value).reduce((sum, s) => sum + s.claims, 0) })).filter((v) => v.claims > 0);

  return {
    asOf: today,
    groupBy: params.groupBy,
    key: String(params.key),
    ...label,
    figures: figuresOf(selectedSums, todayDay),
    network: figuresOf(networkSums, todayDay),
    survival: survivalCurve(observations),
    ...weibullOf(observations),
    failureModes: claimsOf('failureMode', FAILURE_MODES).map(({ value, claims }) => ({ mode: value, claims })),
    coverages: claimsOf('coverage', COVERAGES).map(({ value, claims }) => ({ coverage: value, claims })),
    funnel: funnelOf(await serviceByLocation(db, { ...filter, scope: 'all' }, today), await workmanshipClaims(db, { ...failures, scope: 'all' }), await namedLocations(db, visible), todayDay),
    ...(await marginsOf(db, filter, today, todayDay)),
  };
}

/** The code and name of each location the person may see, by id. */
async function namedLocations(db: Db, scope: LocationScope): Promise<Map<number, NamedLocation>> {
  if (scope !== 'all' && scope.length === 0) return new Map();
  let query = db.selectFrom('locations').select(['id', 'code', 'name']);
  if (scope !== 'all') query = query.where('id', 'in', scope);
  return new Map((await query.execute()).map((l) => [l.id, l]));
}

async function marginsOf(db: Db, filter: UnitFilter, today: string, todayDay: number): Promise<Pick<ReliabilityDetail, 'margins' | 'plannedUnits'>> {
  const planned = await unitSums(db, filter, 'bands', today);
  const margins = planned
    .map(({ key, ...sums }) => ({ measure: MARGIN_MEASURES[Math.floor(Number(key) / 10) - 1]!, band: (Number(key) % 10) as MarginRow['band'], ...figuresOf(sums, todayDay) }))
    .sort((a, b) => MARGIN_MEASURES.indexOf(a.measure) - MARGIN_MEASURES.indexOf(b.measure) || a.band - b.band);
  return { margins, plannedUnits: margins.filter((m) => m.measure === 'drop').reduce((sum, m) => sum + m.units, 0) };
}
