import { sql, type Kysely } from 'kysely';

/**
 * The weekly e-mail of last week's figures: whether each person wants it (on unless they turn it
 * off), and each one sent, so a week's e-mail goes once however often the sender looks.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table users add column weekly_digest integer not null default 1`.execute(db);
  await sql`create table weekly_digests (user_id integer not null references users (id), week text not null, sent_at text not null, primary key (user_id, week))`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop table weekly_digests`.execute(db);
  await sql`alter table users drop column weekly_digest`.execute(db);
}
