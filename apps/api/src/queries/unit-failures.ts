import { addMonthsIso, dayOfIso } from '@busbar/calc';
import type { Database, Db } from '@busbar/db';
import type { Coverage, FailureMode } from '@busbar/shared';
import { sql, type SelectQueryBuilder, type SqlBool } from 'kysely';
import type { LocationScope } from '../access/locations.ts';
import { wholeRegions } from './regions.ts';

/** Which failures: of these catalog items, among units installed in the months (YYYY-MM, inclusive), at these locations. */
export interface FailureFilter {
  itemIds: number[];
  from?: string;
  to?: string;
  scope: LocationScope;
}

const itemsIn = (itemIds: number[]) => (itemIds.length > 0 ? itemIds : [0]);

function failuresOf(db: Db, { itemIds, from, to, scope }: FailureFilter): SelectQueryBuilder<Database, 'unitFailures', object> {
  let query = db.selectFrom('unitFailures').where('catalogItemId', 'in', itemsIn(itemIds));
  if (from) query = query.where('installedDay', '>=', dayOfIso(`${from}-01`));
  if (to) query = query.where('installedDay', '<', dayOfIso(addMonthsIso(`${to}-01`, 1)));
  if (scope !== 'all') query = query.where('locationId', 'in', scope.length > 0 ? scope : [0]);
  return query;
}

/**
 * Where the failures `filter` picks are counted already (migration 043): over every install month,
 * the whole network's or whole regions' (a regional manager's scope); otherwise null.
 */
async function keptCounts(db: Db, { from, to, scope }: FailureFilter): Promise<'network' | number[] | null> {
  if (from || to) return null;
  return scope === 'all' ? 'network' : wholeRegions(db, scope);
}

/**
 * The kept counts (migration 043) of ages or of kinds of failure of the items, the network's or
 * those regions' (typed as the network's table, whose columns the regions' has too).
 */
function keptRows(db: Db, kind: 'Ages', kept: 'network' | number[], itemIds: number[]): SelectQueryBuilder<Database, 'unitFailureAgesNetwork', object>;
function keptRows(db: Db, kind: 'Kinds', kept: 'network' | number[], itemIds: number[]): SelectQueryBuilder<Database, 'unitFailureKindsNetwork', object>;
function keptRows(db: Db, kind: 'Ages' | 'Kinds', kept: 'network' | number[], itemIds: number[]): SelectQueryBuilder<Database, 'unitFailureAgesNetwork' | 'unitFailureKindsNetwork', object> {
  const rows = db.selectFrom(`unitFailure${kind}${kept === 'network' ? 'Network' : 'Region'}` as 'unitFailureAgesNetwork').where('catalogItemId', 'in', itemsIn(itemIds));
  return kept === 'network' ? rows : rows.where(sql<SqlBool>`region_id in (${sql.join(kept)})`);
}

/**
 * How many units failed at each age in days (failed day − install day): from the kept counts when
 * they hold them. Else the whole network's are counted per item in the order of the ages' index
 * (migration 041), then the items' counts per age added up; a scope's fewer failures are sought by
 * shop or by install day and sorted.
 */
export async function failureAges(db: Db, filter: FailureFilter): Promise<{ days: number; failures: number }[]> {
  const kept = await keptCounts(db, filter);
  const summed = sql<number>`sum(failures)`.as('failures');
  if (kept) return keptRows(db, 'Ages', kept, filter.itemIds).select(['ageDays as days', summed]).groupBy('ageDays').execute();
  const failures = sql<number>`count(*)`.as('failures');
  if (filter.scope !== 'all') return failuresOf(db, filter).select([sql<number>`failed_day - installed_day`.as('days'), failures]).groupBy('days').execute();
  return db
    .selectFrom(failuresOf(db, filter).select(['ageDays', failures]).groupBy(['catalogItemId', 'ageDays']).as('perItem'))
    .select(['ageDays as days', summed])
    .groupBy('ageDays')
    .execute();
}

type Share = { failureMode: FailureMode; coverage: Coverage; claims: number };

/**
 * Claims by failure mode and coverage: from the kept counts when they hold them, else counted per
 * item in the order of the claims' index by item, coverage and mode (migration 038), which a count
 * by mode and coverage alone would sort first.
 */
export async function claimShares(db: Db, filter: FailureFilter): Promise<Share[]> {
  const kept = await keptCounts(db, filter);
  if (kept) {
    return keptRows(db, 'Kinds', kept, filter.itemIds).select(['failureMode', 'coverage', sql<number>`sum(failures)`.as('claims')]).groupBy(['coverage', 'failureMode']).execute();
  }
  const perItem = await failuresOf(db, filter)
    .select(['failureMode', 'coverage', sql<number>`count(*)`.as('claims')])
    .groupBy(['catalogItemId', 'coverage', 'failureMode'])
    .execute();
  const shares = new Map<string, Share>();
  for (const row of perItem) {
    const key = `${row.failureMode} ${row.coverage}`;
    shares.set(key, { ...row, claims: (shares.get(key)?.claims ?? 0) + row.claims });
  }
  return [...shares.values()];
}

/** Claims under the shop's own workmanship warranty, by location: the whole network's over every install month as counted (migration 046). */
export async function workmanshipClaims(db: Db, filter: FailureFilter): Promise<Map<number, number>> {
  if (filter.scope === 'all' && !filter.from && !filter.to) {
    const counted = await db
      .selectFrom('unitFailureWorkmanship')
      .where('catalogItemId', 'in', itemsIn(filter.itemIds))
      .select(['locationId', sql<number>`sum(failures)`.as('claims')])
      .groupBy('locationId')
      .execute();
    return new Map(counted.map((row) => [row.locationId, row.claims]));
  }
  const rows = await failuresOf(db, filter)
    .where('coverage', '=', 'workmanship')
    .select(['locationId', sql<number>`count(*)`.as('claims')])
    // Grouped by the value, not in the shop index's order: that index would be skip-scanned for
    // every shop, where the kinds index seeks each item's workmanship claims and sorts those few.
    .groupBy(sql`+location_id`)
    .execute();
  return new Map(rows.map((row) => [row.locationId, row.claims]));
}

/** The catalog items of an item, category or vendor. */
export async function itemsOf(db: Db, group: { groupBy: 'item' | 'category' | 'vendor'; key: number | string }): Promise<number[]> {
  let query = db.selectFrom('catalogItems').select('id');
  if (group.groupBy === 'item') query = query.where('id', '=', Number(group.key));
  else if (group.groupBy === 'vendor') query = query.where('vendorId', '=', Number(group.key));
  else query = query.where('category', '=', group.key as never);
  return (await query.execute()).map((row) => row.id);
}
