import type { Kysely } from 'kysely';

/** A shop's builds in number order (the build list sorted by number, for one location). */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.createIndex('builds_location_number').on('builds').columns(['location_id', 'number']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropIndex('builds_location_number').execute();
}
