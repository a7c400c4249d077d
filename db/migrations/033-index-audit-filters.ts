import { sql, type Kysely } from 'kysely';

/**
 * The audit log is read newest first by time, whole or by who acted, by kind of record, by one
 * record (a build's history too) and between two times: each reads its own index in `at` order
 * (the id closes each index, so `order by at, id` needs no sort) and stops at the page's end.
 * They supersede the indexes by kind and by record without the time.
 */
const INDEXES: [name: string, columns: string][] = [
  ['audit_log_at', 'at'],
  ['audit_log_actor_at', 'actor_id, at'],
  ['audit_log_entity_at', 'entity, at'],
  ['audit_log_record_at', 'entity, entity_id, at'],
];

export async function up(db: Kysely<any>): Promise<void> {
  for (const [name, columns] of INDEXES) await sql`create index ${sql.id(name)} on audit_log (${sql.raw(columns)})`.execute(db);
  await sql`drop index audit_log_entity_recent`.execute(db);
  await sql`drop index audit_log_entity`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`create index audit_log_entity on audit_log (entity, entity_id)`.execute(db);
  await sql`create index audit_log_entity_recent on audit_log (entity)`.execute(db);
  for (const [name] of [...INDEXES].reverse()) await sql`drop index ${sql.id(name)}`.execute(db);
}
