import type { Db } from '@busbar/db';
import type { LocationListQuery, LocationSettings, LocationView, Page, RegionView } from '@busbar/shared';
import { sql, type Expression, type SqlBool } from 'kysely';
import type { LocationScope } from '../access/locations.ts';
import { cappedCount, offsetOf } from './paging.ts';

/** `column` LIKE `pattern` around `text` taken literally (%, _ and the backslash escaped), in any case. */
const like = (column: string, text: string, pattern: (t: string) => string) =>
  sql<SqlBool>`${sql.ref(column)} like ${pattern(text.replace(/[\\%_]/g, (c) => `\\${c}`))} escape '\\'`;

export function listRegions(db: Db): Promise<RegionView[]> {
  return db.selectFrom('regions').select(['id', 'code', 'name']).orderBy('name').execute();
}

/** The locations of `scope`, by name. */
export function listLocations(db: Db, scope: LocationScope): Promise<LocationView[]> {
  let query = db.selectFrom('locations').select(['id', 'regionId', 'code', 'name', 'timeZone']).orderBy('name');
  if (scope !== 'all') query = query.where('id', 'in', scope.length > 0 ? scope : [0]);
  return query.execute();
}

function locationsWithRegions(db: Db) {
  return db
    .selectFrom('locations as l')
    .innerJoin('regions as r', 'r.id', 'l.regionId')
    .select(['l.id', 'l.code', 'l.name', 'l.regionId', 'r.name as regionName', 'l.timeZone', 'l.claimApprovalLimitCents']);
}

/** One page of the locations in `ids` ('all': every one) by code, narrowed by code or name and by region. */
export async function pageLocations(db: Db, ids: LocationScope, query: LocationListQuery): Promise<Page<LocationSettings>> {
  const paging = { page: query.page, pageSize: query.pageSize };
  const matching = locationsWithRegions(db).where((eb) => {
    const conditions: Expression<SqlBool>[] = [];
    if (ids !== 'all') conditions.push(eb('l.id', 'in', ids.length > 0 ? ids : [0]));
    if (query.regionId) conditions.push(eb('l.regionId', '=', query.regionId));
    if (query.q) conditions.push(eb.or([like('l.code', query.q, (t) => `${t}%`), like('l.name', query.q, (t) => `%${t}%`)]));
    return eb.and(conditions);
  });
  const [items, count] = await Promise.all([
    matching.orderBy('l.code').orderBy('l.id').limit(query.pageSize).offset(offsetOf(query.page, query.pageSize)).execute(),
    cappedCount(db, matching),
  ]);
  return { items, ...count, ...paging };
}

export function findLocationSettings(db: Db, id: number): Promise<LocationSettings | undefined> {
  return locationsWithRegions(db).where('l.id', '=', id).executeTakeFirst();
}

export async function setApprovalLimit(db: Db, id: number, claimApprovalLimitCents: number): Promise<void> {
  await db.updateTable('locations').set({ claimApprovalLimitCents }).where('id', '=', id).execute();
}
