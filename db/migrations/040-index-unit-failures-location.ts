import { sql, type Kysely } from 'kysely';

/**
 * A shop's failures of some items: a lead's reliability detail read every failure of the items in
 * the network and kept the shop's (2 ms each for its failure ages and its claim shares on 200
 * shops). This index seeks the shop and the item and holds what both count.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create index unit_failures_location on unit_failures (location_id, catalog_item_id, failed_day, installed_day, failure_mode, coverage)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index unit_failures_location`.execute(db);
}
