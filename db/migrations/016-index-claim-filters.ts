import { sql, type Kysely } from 'kysely';

/**
 * The claims list at network size. It reads the next step due soonest first and closed claims
 * (no due day) last, so its order is an expression an index must hold to walk a page without
 * sorting every claim; the day filters (failed on, logged on) read a range of their own index.
 */
const INDEXES: [name: string, columns: string][] = [
  ['warranty_claims_queue_order', '(due_on is null), due_on'],
  ['warranty_claims_location_queue_order', 'location_id, (due_on is null), due_on'],
  ['warranty_claims_status_queue_order', 'status, (due_on is null), due_on'],
  ['warranty_claims_failed', 'failed_on'],
  ['warranty_claims_location_failed', 'location_id, failed_on'],
  ['warranty_claims_created', 'created_at'],
  ['warranty_claims_location_created', 'location_id, created_at'],
];

export async function up(db: Kysely<any>): Promise<void> {
  for (const [name, columns] of INDEXES) await sql`create index ${sql.id(name)} on warranty_claims (${sql.raw(columns)})`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const [name] of INDEXES) await sql`drop index ${sql.id(name)}`.execute(db);
}
