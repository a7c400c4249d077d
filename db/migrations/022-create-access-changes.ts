import { sql, type Kysely } from 'kysely';

/**
 * A count of changes to who may do what, raised by triggers in the same transaction as the change,
 * whichever connection or process makes it. Each app process keeps people's abilities in memory
 * and keeps an entry only while this count is the one it was built at (access/viewer-cache.ts).
 */
const RAISE = 'update access_changes set generation = generation + 1';
const TRIGGERS: [name: string, event: string][] = [
  ['users_access_update', 'update of status, email, name on users'],
  ['users_access_delete', 'delete on users'],
  ['role_assignments_access_insert', 'insert on role_assignments'],
  ['role_assignments_access_update', 'update on role_assignments'],
  ['role_assignments_access_delete', 'delete on role_assignments'],
  ['locations_access_insert', 'insert on locations'],
  ['locations_access_update', 'update of region_id, code, name on locations'],
  ['locations_access_delete', 'delete on locations'],
  ['regions_access_update', 'update of name on regions'],
  ['regions_access_delete', 'delete on regions'],
];

export async function up(db: Kysely<any>): Promise<void> {
  await sql`create table access_changes (id integer primary key check (id = 1), generation integer not null)`.execute(db);
  await sql`insert into access_changes (id, generation) values (1, 0)`.execute(db);
  for (const [name, event] of TRIGGERS) {
    await sql`create trigger ${sql.id(name)} after ${sql.raw(event)} begin ${sql.raw(RAISE)}; end`.execute(db);
  }
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const [name] of TRIGGERS) await sql`drop trigger ${sql.id(name)}`.execute(db);
  await sql`drop table access_changes`.execute(db);
}
