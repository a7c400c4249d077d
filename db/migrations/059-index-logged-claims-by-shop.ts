import { sql, type Kysely } from 'kysely';

/**
 * Claims by shop and logging day again, with what a count of them reads (migration 047's index,
 * which 056 dropped with the month close's sums): the claims list counts a region's claims logged
 * in a span through it, a seek per shop in the index alone (4.8 ms in process for 86 shops of 200,
 * 7.5 without it). A database that ran 056 while it kept the index has it already.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create index if not exists warranty_claims_logged_sums on warranty_claims (location_id, logged_on, status, credit_requested_cents, credit_received_cents)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index warranty_claims_logged_sums`.execute(db);
}
