import { sql, type Kysely } from 'kysely';

/**
 * Each claim keeps the catalog item of its failed unit, so the claims list filters by vendor or
 * category through an index of its own instead of looking up every claim's unit (0.4-0.5 s for a
 * rare vendor among 200,000 claims). A unit's catalog item never changes. The column is filled
 * from the units here and by every insert after; SQLite adds no NOT NULL column to a table with rows.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table warranty_claims add column catalog_item_id integer references catalog_items (id)`.execute(db);
  await sql`update warranty_claims set catalog_item_id = (select i.catalog_item_id from build_items i where i.id = warranty_claims.build_item_id)`.execute(db);
  await sql`create index warranty_claims_item_queue_order on warranty_claims (catalog_item_id, (due_on is null), due_on)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index warranty_claims_item_queue_order`.execute(db);
  await sql`alter table warranty_claims drop column catalog_item_id`.execute(db);
}
