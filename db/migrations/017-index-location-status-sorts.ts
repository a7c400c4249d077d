import { sql, type Kysely } from 'kysely';

/**
 * A location's builds of one status in each sort order of the list, read straight from an index:
 * without them a lead's booked builds by date walked every build of the shop in date order to find
 * the few still booked (35-110 ms on a shop with five years of history). They cover what
 * builds_location_status did, so that one goes.
 */
const INDEXES: [name: string, columns: string][] = [
  ['builds_location_status_booked', 'location_id, status, booked_for'],
  ['builds_location_status_total', 'location_id, status, total_cents'],
  ['builds_location_status_number', 'location_id, status, number'],
];

export async function up(db: Kysely<any>): Promise<void> {
  for (const [name, columns] of INDEXES) await sql`create index ${sql.id(name)} on builds (${sql.raw(columns)})`.execute(db);
  await sql`drop index builds_location_status`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`create index builds_location_status on builds (location_id, status)`.execute(db);
  for (const [name] of INDEXES) await sql`drop index ${sql.id(name)}`.execute(db);
}
