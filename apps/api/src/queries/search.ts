import { SHOP_SPAN } from '@busbar/db';
import { COUNT_CAP, SEARCH_CAP } from '@busbar/shared';
import { sql, type Expression, type RawBuilder, type SqlBool } from 'kysely';
import type { LocationScope } from '../access/locations.ts';
import type { Count } from './paging.ts';

/** SQLite's LIKE has no escape character unless a query names one: `\` here, so % and _ are literal. */
const literal = (text: string) => text.replace(/[\\%_]/g, (c) => `\\${c}`);

/** `column` contains `text`, in any case (LIKE ignores the case of ASCII letters). */
export const contains = (column: string, text: string) => sql<boolean>`${sql.ref(column)} like ${`%${literal(text)}%`} escape '\\'`;

/** The trigram indexes find any run of 3 or more characters; shorter text is looked for row by row. */
const TRIGRAM_LENGTH = 3;

export const isIndexable = (text: string) => [...text].length >= TRIGRAM_LENGTH;

/** The count cap of a list searched for `text`. */
export const countCapFor = (text: string | undefined) => (text ? SEARCH_CAP : COUNT_CAP);

/** `text` as one FTS5 phrase: any run of its characters, in any case. */
export const phrase = (text: string) => `"${text.replaceAll('"', '""')}"`;

/**
 * Past this many locations a scope is a good part of the network: walking the matches and
 * dropping other locations' rows is cheaper than the index's union of that many markers.
 */
const PLACE_MARKERS_MAX = 16;

/** Whether the full-text index narrows a search to the scope's locations itself (see inPlaces). */
export const narrowsByPlace = (scope: LocationScope): scope is number[] => scope !== 'all' && scope.length <= PLACE_MARKERS_MAX;

/**
 * An FTS5 query narrowed to a few locations through the `place` markers of the indexes
 * (migration 015), so the index walks only those locations' rows. A larger scope is left to the
 * caller's own location condition.
 */
export function inPlaces(query: string, scope: LocationScope): string {
  if (!narrowsByPlace(scope)) return query;
  return `(${query}) AND place : (${scope.map((id) => `"@${id}@"`).join(' OR ')})`;
}

/** Up to this many shops, a search reads each one's range of a per-shop index, and merges them. */
const SHOP_RANGES_MAX = 4;

/**
 * Whether a search reads the scope's shops' ranges of the per-shop indexes `shop_build_search`
 * and `shop_customer_search` (migrations 049, 050), whose rowids are the shop's id times SHOP_SPAN
 * plus the build's or customer's id: so a shop's search costs what its own history does.
 */
export const readsShopRanges = (scope: LocationScope): scope is number[] => scope !== 'all' && scope.length <= SHOP_RANGES_MAX;

/**
 * A shop's part of a per-shop index (`s`). The bounds are cast to integers in SQL: a number past
 * 2^31 is bound as a real, and with a real bound FTS5 read the whole network's match lists (19 ms
 * instead of 1.7 for one shop).
 */
export function inShopRange(locationId: number): RawBuilder<SqlBool> {
  return sql<SqlBool>`s.rowid between cast(${locationId * SHOP_SPAN} as integer) and cast(${(locationId + 1) * SHOP_SPAN - 1} as integer)`;
}

/** The build's or customer's id of a row of a shop's part of a per-shop index (`s`). */
export const shopRowId = (locationId: number): RawBuilder<number> => sql<number>`s.rowid - cast(${locationId * SHOP_SPAN} as integer)`;

/** The newest `limit` of each shop's matches (by the id `idOf` reads), merged newest first. */
export async function newestOfShops<T>(shops: readonly number[], rowsOf: (locationId: number) => Promise<T[]>, idOf: (row: T) => number, limit: number): Promise<T[]> {
  const rows = (await Promise.all(shops.map(rowsOf))).flat();
  return rows.sort((a, b) => idOf(b) - idOf(a)).slice(0, limit);
}

/**
 * The full-text index's row id as a search's matches are read newest first (`s` is the index).
 * FTS5 reads a match list backwards slower than forwards: where place markers keep the matches to a
 * few shops', reading them forwards and sorting them is quicker; across many shops the backward
 * walk stops at the cap instead of reading every match in the network.
 */
export const newestFirst = (scope: LocationScope): RawBuilder<number> => (narrowsByPlace(scope) ? sql<number>`+s.rowid` : sql<number>`s.rowid`);

/**
 * A list's matches and count from the newest SEARCH_CAP + 1 matches of a search, read once: the
 * list is the newest SEARCH_CAP, and one more than that tells the count there are more.
 */
export function cappedMatches<R>(newest: readonly R[]): { kept: R[]; count: Count } {
  const kept = newest.slice(0, SEARCH_CAP);
  return { kept, count: { total: kept.length, totalCapped: newest.length > SEARCH_CAP } };
}

/**
 * The FTS5 query for builds whose number, customer name, vehicle, its VIN or plate, or a serial
 * number contains `text`, in the scope and, when some are asked for, in these statuses (the
 * `state` markers).
 */
export function buildTextQuery(text: string, scope: LocationScope, statuses: readonly string[]): string {
  const query = `{number customer vehicle vin plate serials} : ${phrase(text)}`;
  return inPlaces(statuses.length === 0 ? query : `${query} AND state : (${statuses.map((s) => `"#${s}#"`).join(' OR ')})`, scope);
}

/**
 * Builds (by `idColumn`) whose number, customer name, vehicle, VIN, plate or a serial number
 * contains `text` of 1 or 2 characters, in any case: matched with LIKE against the text the index
 * is made from (`build_search_source`) as the sort order reaches each build.
 */
export function shortBuildTextMatch(idColumn: string, text: string): Expression<SqlBool> {
  const like = `%${literal(text)}%`;
  const columns = ['number', 'customer', 'vehicle', 'vin', 'plate', 'serials'].map((column) => sql`${sql.ref(`s.${column}`)} like ${like} escape '\\'`);
  return sql<SqlBool>`exists (select 1 from build_search_source s where s.id = ${sql.ref(idColumn)} and (${sql.join(columns, sql` or `)}))`;
}
