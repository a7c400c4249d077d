import { sql, type Kysely } from 'kysely';

/**
 * Each limited e-mail, one row per limit it counts against (`limit_key`, e.g. one claim's
 * return requests or one person's re-invites), kept in the database so every app process counts
 * the same ones. Rows older than the counting window are deleted as new ones come in.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create table mail_sends (
    id integer primary key,
    limit_key text not null,
    at text not null
  )`.execute(db);
  await sql`create index mail_sends_key on mail_sends (limit_key, at)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop table mail_sends`.execute(db);
}
