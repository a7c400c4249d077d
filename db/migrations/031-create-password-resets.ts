import { sql, type Kysely } from 'kysely';

/** Password-reset links: single use, stored only as the SHA-256 of their token, with an expiry. */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create table password_resets (
    id integer primary key,
    user_id integer not null references users (id) on delete cascade,
    token_hash text not null unique,
    created_at text not null,
    expires_at text not null,
    used_at text
  )`.execute(db);
  await sql`create index password_resets_user on password_resets (user_id)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop table password_resets`.execute(db);
}
