import type { Db } from '@busbar/db';
import { SEARCH_CAP, type Page, type SerialMatch } from '@busbar/shared';
import { sql } from 'kysely';
import type { LocationScope } from '../access/locations.ts';
import { cappedCount, offsetOf } from './paging.ts';
import { inPlaces, narrowsByPlace, phrase, startsWith } from './search.ts';

/** Serial numbers in any case, the order of the `build_items_serial_nocase` index that finds a prefix. */
const serialOrder = sql`${sql.ref('i.serialNumber')} collate nocase`;

/** Installed units whose serial number starts with `prefix` (any case), in the scope, a page at a time. */
export async function findSerials(db: Db, scope: LocationScope, filter: { q: string; page: number; pageSize: number }): Promise<Page<SerialMatch>> {
  const { page, pageSize } = filter;
  if (scope !== 'all' && scope.length === 0) return { items: [], total: 0, totalCapped: false, page, pageSize };
  let matching = db.selectFrom('buildItems as i').where(startsWith('i.serialNumber', filter.q));
  if (narrowsByPlace(scope)) {
    // The scope's builds that hold a serial number with this text (3 or more characters), from the full-text
    // index's place markers: a lead's search reads their own shop's units, not every unit in the network that starts so.
    const held = sql<number>`(select rowid from build_search where build_search match ${inPlaces(`serials : ${phrase(filter.q)}`, scope)})`;
    matching = matching.where('i.buildId', 'in', held);
  } else if (scope !== 'all') {
    // A good part of the network: its units come often enough in serial-number order.
    matching = matching.where((eb) => eb.exists(eb.selectFrom('builds as b').select('b.id').whereRef('b.id', '=', 'i.buildId').where('b.locationId', 'in', scope)));
  }
  const [keys, count] = await Promise.all([
    matching.select('i.id').orderBy(serialOrder).orderBy('i.id').limit(pageSize).offset(offsetOf(page, pageSize)).execute(),
    cappedCount(db, matching.select('i.id'), SEARCH_CAP),
  ]);
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
