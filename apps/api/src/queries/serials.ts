import type { Db } from '@busbar/db';
import { SEARCH_CAP, type Page, type SerialMatch } from '@busbar/shared';
import { sql, type SqlBool } from 'kysely';
import type { LocationScope } from '../access/locations.ts';
import { offsetOf } from './paging.ts';
import { cappedMatches, contains, inPlaces, narrowsByPlace, inShopRange, newestFirst, newestOfShops, phrase, readsShopRanges, shopRowId } from './search.ts';

/**
 * The newest SEARCH_CAP + 1 installed units whose serial number contains `q` (3 or more characters,
 * any case), in the scope, newest build first, with their numbers. The full-text index over builds
 * finds the builds that hold such a serial as it walks them newest first, so a common piece of a
 * number costs no more than a rare one; LIKE then keeps the units of each build whose own number
 * holds the text, read from the index of lines by build (migration 062).
 */
function newestUnits(db: Db, scope: LocationScope, q: string): Promise<Unit[]> {
  if (readsShopRanges(scope)) {
    const ofShop = (locationId: number) =>
      db
        .selectFrom(sql<{ rowid: number }>`shop_build_search`.as('s'))
        .innerJoin('buildItems as i', (join) => join.on(sql<SqlBool>`i.build_id = ${shopRowId(locationId)}`))
        .where(sql<SqlBool>`s.shop_build_search match ${`serials : ${phrase(q)}`} and ${inShopRange(locationId)}`)
        .where(contains('i.serialNumber', q))
        .select(['i.id', 'i.serialNumber', 'i.buildId'])
        .orderBy(sql`s.rowid`, 'desc')
        .limit(SEARCH_CAP + 1)
        .execute();
    return newestOfShops(scope, ofShop, (unit) => unit.buildId, SEARCH_CAP + 1);
  }
  let units = db
    .selectFrom(sql<{ rowid: number }>`build_search`.as('s'))
    .innerJoin('buildItems as i', 'i.buildId', 's.rowid')
    .where(sql<SqlBool>`s.build_search match ${inPlaces(`serials : ${phrase(q)}`, scope)}`)
    .where(contains('i.serialNumber', q));
  // A good part of the network: its builds come often enough among the newest matches.
  if (scope !== 'all' && !narrowsByPlace(scope)) units = units.innerJoin('builds as b', 'b.id', 's.rowid').where('b.locationId', 'in', scope);
  return units.select(['i.id', 'i.serialNumber']).orderBy(newestFirst(scope), 'desc').limit(SEARCH_CAP + 1).execute();
}

type Unit = { id: number; serialNumber: string | null };

/**
 * Units in the order of their serial numbers in any case, as SQLite's NOCASE collation orders
 * them (ASCII letters as lower case; serial numbers are ASCII), then by id.
 */
function bySerialNumber(units: readonly Unit[]): Unit[] {
  const keyed = units.map((unit) => ({ unit, key: (unit.serialNumber ?? '').toLowerCase() }));
  keyed.sort((a, b) => (a.key < b.key ? -1 : a.key > b.key ? 1 : a.unit.id - b.unit.id));
  return keyed.map((k) => k.unit);
}

/**
 * Installed units whose serial number contains `q` (any case), in the scope: the newest SEARCH_CAP
 * of them sorted by serial number, a page at a time, and their count up to "more than" SEARCH_CAP.
 */
export async function findSerials(db: Db, scope: LocationScope, filter: { q: string; page: number; pageSize: number }): Promise<Page<SerialMatch>> {
  const { q, page, pageSize } = filter;
  if (scope !== 'all' && scope.length === 0) return { items: [], total: 0, totalCapped: false, page, pageSize };
  const offset = offsetOf(page, pageSize);
  const { kept, count } = cappedMatches(await newestUnits(db, scope, q));
  const keys = bySerialNumber(kept).slice(offset, offset + pageSize);
  if (keys.length === 0) return { items: [], ...count, page, pageSize };
  const rows = await db
    .selectFrom('buildItems as i')
    .innerJoin('builds as b', 'b.id', 'i.buildId')
    .innerJoin('locations as l', 'l.id', 'b.locationId')
    .innerJoin('catalogItems as c', 'c.id', 'i.catalogItemId')
    .select(['i.id', 'i.serialNumber', 'i.sku', 'c.name', 'b.id as buildId', 'b.number as buildNumber', 'l.code as locationCode', 'b.status', 'b.deliveredAt'])
    .where('i.id', 'in', keys.map((k) => k.id))
    .execute();
  const byId = new Map(rows.map(({ id, ...match }) => [id, match as SerialMatch]));
  return { items: keys.map((k) => byId.get(k.id)!), ...count, page, pageSize };
}
