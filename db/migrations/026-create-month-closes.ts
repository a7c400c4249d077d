import { sql, type Kysely } from 'kysely';

/**
 * Months the accountant marked final, per location: the figures as closed (never changed again),
 * and what of the month has been accounted for so far (`carried`: its builds, revenue, parts cost
 * and credits received, as the roll-ups had them), so a later change to a closed month's builds or
 * claims shows once, as an adjustment in the next month closed.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create table month_closes (
    location_id integer not null references locations (id),
    month text not null,
    finalized_at text not null,
    finalized_by integer references users (id),
    figures text not null,
    carried text not null,
    primary key (location_id, month)
  ) without rowid`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop table month_closes`.execute(db);
}
