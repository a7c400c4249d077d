import { sql, type Kysely } from 'kysely';

/**
 * Royalty terms with the month they apply from: the royalty and the marketing-fund percentages
 * (basis points) the owner sets for each location. A month's close takes the terms in force that
 * month. Each location's royalty so far becomes its terms from the first month anyone could have
 * closed (2000-01), with no marketing fund; the location's own column goes.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create table royalty_terms (
    id integer primary key,
    location_id integer not null references locations (id),
    applies_from text not null check (applies_from glob '[0-9][0-9][0-9][0-9]-[0-1][0-9]'),
    royalty_basis_points integer not null check (royalty_basis_points between 0 and 10000),
    marketing_basis_points integer not null check (marketing_basis_points between 0 and 10000),
    created_by integer references users (id),
    created_at text not null,
    unique (location_id, applies_from)
  )`.execute(db);
  await sql`insert into royalty_terms (location_id, applies_from, royalty_basis_points, marketing_basis_points, created_by, created_at)
    select id, '2000-01', royalty_basis_points, 0, null, strftime('%Y-%m-%dT%H:%M:%fZ', 'now') from locations`.execute(db);
  await sql`alter table locations drop column royalty_basis_points`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table locations add column royalty_basis_points integer not null default 0 check (royalty_basis_points between 0 and 10000)`.execute(db);
  await sql`update locations set royalty_basis_points = coalesce((select t.royalty_basis_points from royalty_terms t where t.location_id = locations.id order by t.applies_from desc limit 1), 0)`.execute(db);
  await sql`drop table royalty_terms`.execute(db);
}
