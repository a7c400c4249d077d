import type { Kysely } from 'kysely';

/** An import matches each row's customer by e-mail at the location: one lookup per row. */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.createIndex('customers_location_email').on('customers').columns(['location_id', 'email']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropIndex('customers_location_email').execute();
}
