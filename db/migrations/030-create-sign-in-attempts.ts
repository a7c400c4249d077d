import { sql, type Kysely } from 'kysely';

/**
 * Failed sign-ins and password-reset requests, one row each, kept in the database so every app
 * process counts the same ones. A row older than the counting window is never read and is
 * deleted as new rows come in.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create table sign_in_attempts (
    id integer primary key,
    kind text not null check (kind in ('sign_in', 'reset')),
    email text not null,
    address text not null,
    at text not null
  )`.execute(db);
  await sql`create index sign_in_attempts_email on sign_in_attempts (kind, email, at)`.execute(db);
  await sql`create index sign_in_attempts_address on sign_in_attempts (kind, address, at)`.execute(db);
  await sql`create index sign_in_attempts_at on sign_in_attempts (at)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop table sign_in_attempts`.execute(db);
}
