import type { Kysely } from 'kysely';
import { create, drop, type SearchIndex } from './015-add-search-places.ts';
import { edited, WITH_VIN_AND_PLATE } from './048-search-builds-by-vin-and-plate.ts';

/** Each shop's builds hold rowids of their own in `shop_build_search`: the shop's id times this, plus the build's id. */
export const SHOP_SPAN = 2 ** 32;

/**
 * A second build search index whose rowids keep each shop's builds together, newest last: a
 * search in one shop reads only the shop's part of each trigram's match list (a range of rowids),
 * so it costs what the shop's own history does, not the network's. Through the `place` marker of
 * `build_search` the same search read the whole network's match lists: 5.6 ms on the 200-shop
 * network for "Holloway" in one shop, against 1.1 ms for a range of as many builds. Triggers keep
 * it current as 015 keeps `build_search`, naming builds by `build_id`. The price: on that network
 * 630 MB more on disk (`build_search` holds 535), 93 s to build it once, and every change to a
 * build's searched text written to both indexes.
 */
const SHOP_BUILDS: SearchIndex = {
  table: 'shop_build_search',
  view: 'shop_build_search_source',
  columns: edited(WITH_VIN_AND_PLATE.columns, 'serials, place, state', 'serials, state'),
  source: edited(
    edited(WITH_VIN_AND_PLATE.source, 'select b.id, ', `select b.location_id * ${SHOP_SPAN} + b.id as id, b.id as build_id, `),
    `'@' || b.location_id || '@' as place, `,
    '',
  ),
  triggers: WITH_VIN_AND_PLATE.triggers.map(([name, when, change]) => [`shop_${name}`, when, `${change[0]}build_${change.slice(1)}`]),
};

export async function up(db: Kysely<any>): Promise<void> {
  await create(db, SHOP_BUILDS);
}

export async function down(db: Kysely<any>): Promise<void> {
  await drop(db, SHOP_BUILDS.table, SHOP_BUILDS.view);
}
