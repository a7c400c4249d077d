import type { Db } from '@busbar/db';
import type { ClaimQuery, Page } from '@busbar/shared';
import { sql, type Expression, type ExpressionBuilder, type SqlBool } from 'kysely';
import type { LocationScope } from '../access/locations.ts';
import { claimsWithNames, localToday, toRow, type ClaimRow } from './claims.ts';
import { cappedCount, offsetOf, type Count } from './paging.ts';

type Claims = ExpressionBuilder<any, any>;

/** The scope's locations by time zone: "today" is a day at the claim's own location. */
async function locationsByZone(db: Db, scope: LocationScope): Promise<Map<string, number[]>> {
  const zones = new Map<string, number[]>();
  let locations = db.selectFrom('locations').select(['id', 'timeZone']);
  if (scope !== 'all') locations = locations.where('id', 'in', scope);
  for (const l of await locations.execute()) zones.set(l.timeZone, [...(zones.get(l.timeZone) ?? []), l.id]);
  return zones;
}

/**
 * Claims whose next step was due before today at their location. The latest "today" of all zones
 * first, as a range of the queue-order index (which walks only due claims, overdue first); a claim
 * due before the earliest is overdue everywhere; only those due between (zones differ by a day at
 * most) are judged by their location's zone, its ids unindexed so no seek per location is planned.
 */
function overdue(eb: Claims, zones: Map<string, number[]>, now: Date): Expression<SqlBool> {
  const todays = [...zones].map(([zone, ids]) => ({ ids, today: localToday(zone, now) }));
  const days = todays.map((t) => t.today).sort();
  const exactly = eb.or(todays.map(({ ids, today }) => eb.and([eb(sql<number>`+w.location_id`, 'in', ids), eb('w.dueOn', '<', today)])));
  return eb.and([eb('w.dueOn', '<', days.at(-1)!), eb.or([eb('w.dueOn', '<', days[0]!), exactly])]);
}

/** The list's filters as conditions on `warranty_claims` alone, so paging and counting need no join. */
const byUnit = (query: ClaimQuery) => query.vendorId !== undefined || query.category !== undefined;

/** A span of failure or logging days, which each shop's index of those days holds in the queue's order (migration 060). */
const byDays = (query: ClaimQuery) => [query.failedFrom, query.failedTo, query.loggedFrom, query.loggedTo].some((day) => day !== undefined);

/**
 * The most claims of a span of days a page is sorted from: a region's month on 200 shops (2,000)
 * sorts in 3.2 ms against a walk's 4.2, a span of years (10,000 and more) in 7.4 against 2.3.
 */
export const SORTED_SPAN_MOST = 5000;

/**
 * Whether a page of the scope's claims is found sooner by walking the queue order of the whole
 * network and keeping the scope's than by sorting every claim of the scope: so for a scope of a
 * good share of the network's shops (a region of 93 shops of 200: 4.5 ms of sorting against 0.05),
 * unless a vendor or category narrows the claims through the item's index first, or a span of days
 * holding few enough of them (`count`) through each shop's index of those days.
 */
async function walksQueue(db: Db, scope: LocationScope, query: ClaimQuery, count: Count): Promise<boolean> {
  if (scope === 'all' || scope.length < 2 || byUnit(query) || (byDays(query) && count.total <= SORTED_SPAN_MOST)) return false;
  const { locations } = await db.selectFrom('locations').select((eb) => eb.fn.countAll<number>().as('locations')).executeTakeFirstOrThrow();
  return scope.length >= locations * WALK_SHARE;
}
/** The least share of the network's shops whose claims walk the queue order. */
const WALK_SHARE = 0.25;

/** The claims the query finds; `walk` keeps the location indexes out of it (see walksQueue). */
async function matchingClaims(db: Db, scope: LocationScope, query: ClaimQuery, now: Date) {
  let catalogIds: number[] = [];
  if (byUnit(query)) {
    let items = db.selectFrom('catalogItems').select('id');
    if (query.vendorId !== undefined) items = items.where('vendorId', '=', query.vendorId);
    if (query.category !== undefined) items = items.where('category', '=', query.category);
    catalogIds = (await items.execute()).map((i) => i.id);
  }
  const zones = query.overdue ? await locationsByZone(db, scope) : new Map<string, number[]>();
  return (walk: boolean) =>
    db.selectFrom('warrantyClaims as w').where((eb) => {
      const conditions: Expression<SqlBool>[] = [];
      if (scope !== 'all') conditions.push(eb(walk ? sql<number>`+w.location_id` : 'w.locationId', 'in', scope));
      if (query.status) conditions.push(eb('w.status', '=', query.status));
      if (query.coverage) conditions.push(eb('w.coverage', '=', query.coverage));
      if (query.failureMode) conditions.push(eb('w.failureMode', '=', query.failureMode));
      if (query.buildId) conditions.push(eb('w.buildId', '=', query.buildId));
      if (query.failedFrom) conditions.push(eb('w.failedOn', '>=', query.failedFrom));
      if (query.failedTo) conditions.push(eb('w.failedOn', '<=', query.failedTo));
      // The day each claim was logged at its location, kept with it (as the month close and the roll-ups count it).
      if (query.loggedFrom) conditions.push(eb('w.loggedOn', '>=', query.loggedFrom));
      if (query.loggedTo) conditions.push(eb('w.loggedOn', '<=', query.loggedTo));
      if (query.overdue) conditions.push(overdue(eb, zones, now));
      // The catalog is small: its matching items are looked up once, and each claim keeps its unit's item.
      if (byUnit(query)) conditions.push(catalogIds.length > 0 ? eb('w.catalogItemId', 'in', catalogIds) : sql<SqlBool>`0`);
      return eb.and(conditions);
    });
}

/**
 * One page of the claims at the given locations (already narrowed to the `locationId` asked for):
 * the next step due soonest (overdue) first, closed claims last. The page's ids come from the
 * indexes of `warranty_claims`; only those rows are joined to their names.
 */
export async function listClaims(db: Db, scope: LocationScope, query: ClaimQuery, now: Date): Promise<Page<ClaimRow>> {
  const paging = { page: query.page, pageSize: query.pageSize };
  if (scope !== 'all' && scope.length === 0) return { items: [], total: 0, totalCapped: false, ...paging };
  const offset = offsetOf(query.page, query.pageSize);
  const matching = await matchingClaims(db, scope, query, now);
  // Counted first: how many a span of days holds decides how its page is read.
  const count = await cappedCount(db, matching(false).select('w.id'));
  const keys = await matching(await walksQueue(db, scope, query, count))
    .select('w.id')
    .orderBy(sql`w.due_on is null`)
    .orderBy('w.dueOn', 'asc')
    .orderBy('w.id', 'asc')
    .limit(query.pageSize)
    .offset(offset)
    .execute();
  const rows = keys.length === 0 ? [] : await claimsWithNames(db).where('w.id', 'in', keys.map((k) => k.id)).execute();
  const byId = new Map(rows.map((row) => [row.id, toRow(row)]));
  return { items: keys.map((k) => byId.get(k.id)!), ...count, ...paging };
}
