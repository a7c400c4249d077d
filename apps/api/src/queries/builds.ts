import type { Db } from '@busbar/db';
import { SEARCH_CAP, type BuildEventView, type BuildItemView, type BuildQuery, type BuildStatus, type BuildView, type Page } from '@busbar/shared';
import { sql, type Expression, type SqlBool } from 'kysely';
import type { LocationScope } from '../access/locations.ts';
import { countedByShopAndStatus, keptBuildCount } from './build-counts.ts';
import { afterKey, cappedCount, type Count, decodeCursor, encodeCursor, offsetOf, type Keyset } from './paging.ts';
import { buildTextQuery, cappedMatches, countCapFor, isIndexable, inShopRange, newestFirst, newestOfShops, readsShopRanges, shopRowId, shortBuildTextMatch } from './search.ts';

export type BuildRow = Required<Omit<BuildView, 'marginCents'>>;

function buildsWithNames(db: Db) {
  return db
    .selectFrom('builds as b')
    .innerJoin('locations as l', 'l.id', 'b.locationId')
    .innerJoin('customers as c', 'c.id', 'b.customerId')
    .innerJoin('vehicles as v', 'v.id', 'b.vehicleId')
    .leftJoin('users as t', 't.id', 'b.leadTechnicianId')
    .select([
      'b.id', 'b.number', 'b.locationId', 'l.code as locationCode', 'b.customerId', 'c.name as customerName', 'b.vehicleId',
      sql<string>`v.year || ' ' || v.make || ' ' || v.model`.as('vehicleLabel'), 'v.vin as vehicleVin', 'v.plate as vehiclePlate',
      'b.status', 'b.leadTechnicianId', 't.name as leadTechnicianName', 'b.bookedFor', 'b.startedAt', 'b.deliveredAt', 'b.deliveredOn',
      'b.laborHours', 'b.laborRateCents', 'b.laborCents', 'b.partsPriceCents', 'b.partsCostCents', 'b.totalCents',
      'b.notes', 'b.version', 'b.createdAt', 'b.updatedAt',
      // Lines of serial-numbered parts still without a serial: a few lines per build, read by the
      // build's index. The + keeps SQLite off the serial-number index, where "no serial" is millions of lines.
      sql<number>`(select count(*) from build_items i join catalog_items ci on ci.id = i.catalog_item_id
        where i.build_id = b.id and ci.serialized = 1 and +i.serial_number is null and +i.removed_on is null)`.as('serialsToRecord'),
    ]);
}

const SORT_COLUMNS = {
  number: 'b.number',
  bookedFor: 'b.bookedFor',
  // Only with a span of delivery days (the query's schema says so): the day's index then reads the
  // page in order, where any other order sorts every delivery of the span (a month of the network's).
  deliveredOn: 'b.deliveredOn',
  status: 'b.status',
  totalCents: 'b.totalCents',
  updatedAt: 'b.updatedAt',
} as const;

const statusesOf = (query: BuildQuery) => (query.status === undefined ? [] : ([] as BuildStatus[]).concat(query.status));

/** The filters of a build list but its text, as conditions on `builds` alone, so counting and paging need no join. */
function filteredBuilds(db: Db, scope: LocationScope, query: BuildQuery) {
  const statuses = statusesOf(query);
  // A span of delivery days is sought through its own index, never through a status's: "delivered"
  // is most of a network's builds, which statistics sampled by PRAGMA optimize can make look like a
  // few (the owner's month of deliveries then walked every delivered build, 1.7 s on 200 shops).
  const byDeliveryDays = Boolean(query.deliveredFrom || query.deliveredTo);
  return db.selectFrom('builds as b').where((eb) => {
    const conditions: Expression<SqlBool>[] = [];
    if (scope !== 'all') conditions.push(eb('b.locationId', 'in', scope));
    if (statuses.length > 0) conditions.push(eb(byDeliveryDays ? sql<BuildStatus>`+b.status` : 'b.status', 'in', statuses));
    if (query.technicianId) conditions.push(eb('b.leadTechnicianId', '=', query.technicianId));
    if (query.from) conditions.push(eb('b.bookedFor', '>=', query.from));
    if (query.to) conditions.push(eb('b.bookedFor', '<=', query.to));
    if (query.deliveredFrom) conditions.push(eb('b.deliveredOn', '>=', query.deliveredFrom));
    if (query.deliveredTo) conditions.push(eb('b.deliveredOn', '<=', query.deliveredTo));
    if (query.hasPlan) {
      const planned = eb.exists(eb.selectFrom('powerPlans as p').select('p.id').whereRef('p.buildId', '=', 'b.id'));
      conditions.push(query.hasPlan === 'true' ? planned : eb.not(planned));
    }
    return eb.and(conditions);
  });
}

/**
 * The newest SEARCH_CAP + 1 of the `filtered` builds whose text holds `q`: for a few shops, from
 * each one's range of `shop_build_search`; for more, from `build_search` (see search.ts).
 */
function newestMatches(filtered: ReturnType<typeof filteredBuilds>, scope: LocationScope, q: string, statuses: readonly string[]): Promise<{ id: number }[]> {
  if (readsShopRanges(scope)) {
    const match = buildTextQuery(q, 'all', statuses);
    const ofShop = (locationId: number) =>
      filtered
        .innerJoin(sql<{ rowid: number }>`shop_build_search`.as('s'), (join) => join.on(sql<SqlBool>`b.id = ${shopRowId(locationId)}`))
        .where(sql<SqlBool>`s.shop_build_search match ${match} and ${inShopRange(locationId)}`)
        .select('b.id')
        .orderBy(sql`s.rowid`, 'desc')
        .limit(SEARCH_CAP + 1)
        .execute();
    return newestOfShops(scope, ofShop, (row) => row.id, SEARCH_CAP + 1);
  }
  return filtered
    .innerJoin(sql<{ rowid: number }>`build_search`.as('s'), 's.rowid', 'b.id')
    .where(sql<SqlBool>`s.build_search match ${buildTextQuery(q, scope, statuses)}`)
    .select('b.id')
    .orderBy(newestFirst(scope), 'desc')
    .limit(SEARCH_CAP + 1)
    .execute();
}

/**
 * The builds a list shows and how many there are. Searched text of 3 or more characters walks a
 * full-text index newest first, in the scope's locations, once (newestMatches): the first
 * SEARCH_CAP + 1 builds that pass the other filters are the list (the newest SEARCH_CAP) and its
 * count (one more tells there are more), so a common name costs no more than a rare one. A list
 * narrowed by nothing but its shops and statuses is counted from the kept counts.
 */
async function matchingBuilds(db: Db, scope: LocationScope, query: BuildQuery): Promise<{ matching: ReturnType<typeof filteredBuilds>; count: Count }> {
  const filtered = filteredBuilds(db, scope, query);
  if (query.q && isIndexable(query.q)) {
    const { kept, count } = cappedMatches(await newestMatches(filtered, scope, query.q, statusesOf(query)));
    const ids = kept.map((row) => row.id);
    return { matching: db.selectFrom('builds as b').where((eb) => (ids.length === 0 ? eb.lit(false) : eb('b.id', 'in', ids))), count };
  }
  if (countedByShopAndStatus(query)) return { matching: filtered, count: await keptBuildCount(db, scope, statusesOf(query)) };
  const matching = query.q ? filtered.where(shortBuildTextMatch('b.id', query.q)) : filtered;
  return { matching, count: await cappedCount(db, matching.select('b.id'), countCapFor(query.q)) };
}

/**
 * One page of builds in the scope (already narrowed to the `locationId` asked for), filtered and sorted as asked: by page number for
 * the first COUNT_CAP rows, or after a `cursor` at any depth. The page's ids come from the
 * indexes of `builds` alone; only those rows are joined to their names.
 */
export async function listBuilds(db: Db, scope: LocationScope, query: BuildQuery): Promise<Page<BuildRow>> {
  const paging = { page: query.page, pageSize: query.pageSize };
  if (scope !== 'all' && scope.length === 0) return { items: [], total: 0, totalCapped: false, nextCursor: null, ...paging };
  const sortColumn = SORT_COLUMNS[query.sort];
  const { matching, count } = await matchingBuilds(db, scope, query);
  let pageIds = matching.select(['b.id', `${sortColumn} as sortValue`]).orderBy(sortColumn, query.order).orderBy('b.id', query.order).limit(query.pageSize);
  if (query.cursor) pageIds = pageIds.where(afterKey(sortColumn, 'b.id', query.order, decodeCursor(query.cursor), query.sort === 'bookedFor'));
  else pageIds = pageIds.offset(offsetOf(query.page, query.pageSize));
  const keys = await pageIds.execute();
  const rows = keys.length === 0 ? [] : await buildsWithNames(db).where('b.id', 'in', keys.map((k) => k.id)).execute();
  const byId = new Map(rows.map((row) => [row.id, row]));
  const last = keys.length === query.pageSize ? keys.at(-1) : undefined;
  return {
    items: keys.map((k) => byId.get(k.id)!),
    ...count,
    ...paging,
    nextCursor: last ? encodeCursor({ value: last.sortValue as Keyset['value'], id: last.id }) : null,
  };
}

export function findBuild(db: Db, id: number): Promise<BuildRow | undefined> {
  return buildsWithNames(db).where('b.id', '=', id).executeTakeFirst();
}

export async function buildItems(db: Db, buildId: number): Promise<Required<BuildItemView>[]> {
  const rows = await db
    .selectFrom('buildItems as i')
    .innerJoin('catalogItems as ci', 'ci.id', 'i.catalogItemId')
    .select(['i.id', 'i.catalogItemId', 'i.sku', 'ci.name', 'ci.category', 'i.quantity', 'ci.serialized', 'i.serialNumber', 'i.removedOn', 'i.unitPriceCents', 'i.unitCostCents'])
    .where('i.buildId', '=', buildId)
    .orderBy('i.id')
    .execute();
  return rows.map((row) => ({ ...row, serialized: row.serialized === 1 }));
}

export function buildEvents(db: Db, buildId: number): Promise<BuildEventView[]> {
  return db
    .selectFrom('buildEvents as e')
    .leftJoin('users as u', 'u.id', 'e.actorId')
    .select(['e.id', 'e.at', 'u.name as actorName', 'e.kind', 'e.fromStatus', 'e.toStatus', 'e.note'])
    .where('e.buildId', '=', buildId)
    .orderBy('e.id')
    .execute();
}

/** The next number of a location's builds: its code and a five-digit sequence. */
export async function nextBuildNumber(db: Db, location: { id: number; code: string }): Promise<{ sequence: number; number: string }> {
  const row = await db
    .selectFrom('builds')
    .select((eb) => eb.fn.max('sequence').as('last'))
    .where('locationId', '=', location.id)
    .executeTakeFirst();
  const sequence = Number(row?.last ?? 0) + 1;
  return { sequence, number: `${location.code}-${String(sequence).padStart(5, '0')}` };
}
