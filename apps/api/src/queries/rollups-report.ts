import type { Db } from '@busbar/db';
import { PERIODS_A_YEAR, periodEnd, periodKey, periodNumber, periodStart, type RollupQuery, type Rollups } from '@busbar/shared';
import { sql, type RawBuilder } from 'kysely';
import { locationScope, type LocationScope } from '../access/locations.ts';
import type { Viewer } from '../access/viewer.ts';
import { invalidField } from '../errors.ts';
import { utf8Of } from '../utf8.ts';
import { byMoneyReads, figuresJson, holdsAny, jsonArrayOf, own, summed, type MoneyReads } from './rollups-json.ts';
import { locationRegions, regionsMadeOf } from './regions.ts';

/** The asked periods with the keys of the period before each and of the same period a year before. */
export function askedPeriods({ grain, from, to }: RollupQuery) {
  const periods: Rollups['periods'] = [];
  for (let n = periodNumber(grain, from); n <= periodNumber(grain, to); n++) {
    periods.push({ period: periodKey(grain, n), start: periodStart(grain, n), end: periodEnd(grain, n), previous: periodKey(grain, n - 1), lastYear: periodKey(grain, n - PERIODS_A_YEAR[grain]) });
  }
  return periods;
}

/** The most location-periods one answer holds (a year by week for a page of 50 shops is about 5,300; a year by day, 38,000, is refused). */
export const MAX_ROLLUP_ROWS = 25_000;

/** Refuses an answer of more than `MAX_ROLLUP_ROWS` location-periods, in words. */
export function checkAnswerSize(locations: number, periods: number): void {
  if (locations * periods > MAX_ROLLUP_ROWS) {
    throw invalidField('to', `That is ${periods} periods (with those compared) for each of ${locations} locations: pick a shorter range or a longer period`);
  }
}

/** Which of the person's shops' rows an answer holds: a page of them by id, or (unpaged) all. */
export type ShopsPage = { page: number; pageSize: number } | 'all';

/**
 * Roll-ups of the locations in `scope` (never empty): the rows of the shops of `shops` (unless
 * `rows` is `none`), the sum of every shop of the scope, each region wholly in it and the whole
 * network, for the asked periods and the ones they are compared with, as the UTF-8 bytes of the JSON
 * of Rollups: the figures are written by SQLite (rollups-json.ts), so the thousands of rows of a
 * year of the network never become JavaScript objects or strings.
 */
export async function rollupReportJson(db: Db, query: RollupQuery, scope: LocationScope, money: MoneyScopes, shops: ShopsPage): Promise<Uint8Array> {
  const { grain } = query;
  const periods = askedPeriods(query);
  const keys = [...new Set(periods.flatMap((p) => [p.period, p.previous, p.lastYear]))];
  const locations = await locationRegions(db);
  const reads = moneyReads(money);
  const scopeIds = (scope === 'all' ? locations.map((l) => l.id) : [...scope]).sort((a, b) => a - b);
  const { page, pageSize } = shops === 'all' ? { page: 1, pageSize: scopeIds.length } : shops;
  const shown = query.rows === 'none' ? [] : scopeIds.slice((page - 1) * pageSize, page * pageSize);
  checkAnswerSize(shown.length, keys.length);
  const inScope = new Set(scopeIds);
  const regionLocations = (regionId: number) => locations.filter((l) => l.regionId === regionId).map((l) => l.id);
  const whole = [...new Set(locations.map((l) => l.regionId))].filter((r) => regionLocations(r).every((id) => inScope.has(id)));
  const [locationId, regionId, period] = [sql.ref<number>('f.location_id'), sql.ref<number>('f.region_id'), sql.ref<string>('f.period')];
  const asked = sql`f.grain = ${grain} and f.period in (${sql.join(keys)})`;
  /** The rows of a table of sums, as `f`, in the asked periods and meeting `where`. */
  const of = (table: string, where: RawBuilder<unknown> = sql`true`) => sql`${sql.table(table)} f where ${asked} and ${where}`;
  const inLocations = (ids: number[]) => sql`f.location_id in (${sql.join(ids.length > 0 ? ids : [0])})`;
  const inRegions = (ids: number[]) => sql`f.region_id in (${sql.join(ids.length > 0 ? ids : [0])})`;

  const rows =
    shown.length === 0
      ? '[]'
      : await jsonArrayOf(
          db,
          byMoneyReads(locationId, shown, (id) => reads([id]), (r) => figuresJson([['locationId', locationId], ['period', period]], own, r)),
          sql`${of('rollup_figures', inLocations(shown))} and ${holdsAny(own)}`,
        );
  // The regions' and the network's sums are kept (migration 042): one row a period.
  const kept = (json: RawBuilder<string>, from: RawBuilder<unknown>, order: RawBuilder<unknown>) =>
    jsonArrayOf(db, sql`json(j)`, sql`(select ${json} as j from ${from} and ${holdsAny(own)} order by ${order})`);
  const regionSums = byMoneyReads(regionId, whole, (id) => reads(regionLocations(id)), (r) => figuresJson([['regionId', regionId], ['period', period]], own, r));
  const regions = await kept(regionSums, of('rollup_region', inRegions(whole)), sql`f.region_id, f.period`);
  const network = await kept(figuresJson([['period', period]], own, reads(scopeIds)), of('rollup_network'), period);
  // A scope of whole regions (a regional manager's) sums its regions' rows; any other, its locations'.
  const summedOver = (from: RawBuilder<unknown>) =>
    jsonArrayOf(db, sql`json(j)`, sql`(select ${figuresJson([['period', period]], summed, reads(scopeIds))} as j from ${from} group by f.period having ${holdsAny(summed)})`);
  const scopeRegions = scope === 'all' ? null : regionsMadeOf(locations, scope);
  const scopeSums = scope === 'all' ? network : await summedOver(scopeRegions ? of('rollup_region', inRegions(scopeRegions)) : of('rollup_figures', inLocations(scope)));
  const head = { grain, periods, page, pageSize, total: scopeIds.length, locationIds: shown };
  return utf8Of([JSON.stringify(head).slice(0, -1), ',"rows":', rows, ',"scope":', scopeSums, ',"regions":', regions, ',"network":', network, '}']);
}

/** The roll-ups as objects, every shop's rows (the weekly e-mail's few). */
export const rollupReport = async (db: Db, query: RollupQuery, scope: LocationScope, money: MoneyScopes): Promise<Rollups> =>
  JSON.parse(new TextDecoder().decode(await rollupReportJson(db, query, scope, money, 'all')));

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
