import type { Kysely } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  // A failed unit is taken out on the day its replacement goes in; the replacement is a line of its
  // own, so its life is counted from its own install date.
  await db.schema.alterTable('build_items').addColumn('removed_on', 'text').execute();
  await db.schema.alterTable('warranty_claims').addColumn('replacement_item_id', 'integer', (c) => c.references('build_items.id')).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('warranty_claims').dropColumn('replacement_item_id').execute();
  await db.schema.alterTable('build_items').dropColumn('removed_on').execute();
}
