import { sql, type Kysely } from 'kysely';

/** The month close sums a month's claims by the day they were logged at their location: read them by that day. */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create index warranty_claims_logged_on on warranty_claims (logged_on) where logged_on is not null`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index warranty_claims_logged_on`.execute(db);
}
