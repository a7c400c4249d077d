import type { Kysely } from 'kysely';
import { create, CUSTOMERS, drop, type SearchIndex } from './015-add-search-places.ts';
import { edited } from './048-search-builds-by-vin-and-plate.ts';
import { SHOP_SPAN } from './049-create-shop-build-search.ts';

/**
 * Customers get a per-shop search index as builds did in 049: rowids are the shop's id times
 * SHOP_SPAN plus the customer's id, so a lead's search reads only the shop's range of each
 * trigram's match list. On the 200-shop network: 173 MB more on disk (`customer_search` holds
 * 159), 26 s to build it once.
 */
const SHOP_CUSTOMERS: SearchIndex = {
  table: 'shop_customer_search',
  view: 'shop_customer_search_source',
  columns: edited(CUSTOMERS.columns, ', place', ''),
  source: edited(edited(CUSTOMERS.source, 'select id, ', `select location_id * ${SHOP_SPAN} + id as id, id as customer_id, `), `, '@' || location_id || '@' as place`, ''),
  triggers: CUSTOMERS.triggers.map(([name, when, change]) => [`shop_${name}`, when, `${change[0]}customer_${change.slice(1)}`]),
};

export async function up(db: Kysely<any>): Promise<void> {
  await create(db, SHOP_CUSTOMERS);
}

export async function down(db: Kysely<any>): Promise<void> {
  await drop(db, SHOP_CUSTOMERS.table, SHOP_CUSTOMERS.view);
}
