import { sql, type Kysely } from 'kysely';

/**
 * Builds by the day they were delivered at their location: the comparison of locations opens a
 * shop's deliveries of some months, and the owner may ask for a day's deliveries network-wide,
 * which without it counted through every build.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create index builds_delivered_on on builds (delivered_on) where delivered_on is not null`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index builds_delivered_on`.execute(db);
}
