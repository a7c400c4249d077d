import { sql, type Kysely } from 'kysely';

/**
 * The owner's overdue claims are counted over the network's claims due before the latest "today"
 * of its zones, each judged by its shop's zone: through the due-day index every claim's shop was
 * read from the table, or the planner sought each of 200 shops apart. This index holds the shop with
 * the due day, so the count reads one range of it alone; it takes the place of the due-day index.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create index warranty_claims_due_location on warranty_claims (due_on, location_id)`.execute(db);
  await sql`drop index warranty_claims_network_due`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`create index warranty_claims_network_due on warranty_claims (due_on)`.execute(db);
  await sql`drop index warranty_claims_due_location`.execute(db);
}
