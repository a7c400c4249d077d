import { sql, type Kysely } from 'kysely';

/**
 * A month's close sums each shop's claims logged in the month: on 200 shops 4,500 claims, each read
 * from the table by the logging day index (2.7 ms) and then grouped. This index holds the claims by
 * shop and logging day with what the close adds up, so each shop's month is one seek through it,
 * in shop order, and a region reads only its shops.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create index warranty_claims_logged_sums on warranty_claims (location_id, logged_on, status, credit_requested_cents, credit_received_cents)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index warranty_claims_logged_sums`.execute(db);
}
