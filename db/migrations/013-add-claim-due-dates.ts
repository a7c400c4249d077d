import type { Kysely } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  // When the claim's next step is due (set at each step); null once it is closed. The queue reads
  // a location's claims by it, overdue first.
  await db.schema.alterTable('warranty_claims').addColumn('due_on', 'text').execute();
  await db.schema.createIndex('warranty_claims_due').on('warranty_claims').columns(['location_id', 'due_on']).execute();
  await db.schema.createIndex('warranty_claims_network_due').on('warranty_claims').column('due_on').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropIndex('warranty_claims_network_due').execute();
  await db.schema.dropIndex('warranty_claims_due').execute();
  await db.schema.alterTable('warranty_claims').dropColumn('due_on').execute();
}
