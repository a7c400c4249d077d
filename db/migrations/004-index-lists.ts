import { sql, type Kysely } from 'kysely';

/**
 * Indexes for the filter and sort columns of every list, so a page costs the same at two shops as
 * at two hundred. `rowid` (the id) closes each index, so `order by x, id` reads straight from it.
 */
const INDEXES: [name: string, table: string, columns: string][] = [
  ['builds_updated', 'builds', 'updated_at'],
  ['builds_booked', 'builds', 'booked_for'],
  ['builds_total', 'builds', 'total_cents'],
  ['builds_status_updated', 'builds', 'status, updated_at'],
  ['builds_location_updated', 'builds', 'location_id, updated_at'],
  ['builds_location_booked', 'builds', 'location_id, booked_for'],
  ['builds_location_total', 'builds', 'location_id, total_cents'],
  ['builds_location_status_updated', 'builds', 'location_id, status, updated_at'],
  ['builds_technician_updated', 'builds', 'lead_technician_id, updated_at'],
  ['builds_customer', 'builds', 'customer_id'],
  ['builds_vehicle', 'builds', 'vehicle_id'],
  // Serial search is by prefix in any case: LIKE 'abc%' uses an index only in NOCASE order.
  ['build_items_serial_nocase', 'build_items', 'serial_number collate nocase'],
  ['customers_name', 'customers', 'name'],
  ['vehicles_location', 'vehicles', 'location_id'],
  ['audit_log_entity_recent', 'audit_log', 'entity'],
  ['users_name', 'users', 'name'],
];

export async function up(db: Kysely<any>): Promise<void> {
  for (const [name, table, columns] of INDEXES) {
    await sql`create index ${sql.id(name)} on ${sql.id(table)} (${sql.raw(columns)})`.execute(db);
  }
  // Superseded: the NOCASE index serves every serial search; the unique (sku, serial) one, clashes.
  await sql`drop index build_items_serial_search`.execute(db);
  await sql`create index power_plans_quick on power_plans (updated_at) where build_id is null`.execute(db);
  await sql`create index power_plans_location_quick on power_plans (location_id, updated_at) where build_id is null`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index power_plans_location_quick`.execute(db);
  await sql`drop index power_plans_quick`.execute(db);
  await db.schema.createIndex('build_items_serial_search').on('build_items').column('serial_number').execute();
  for (const [name] of [...INDEXES].reverse()) await sql`drop index ${sql.id(name)}`.execute(db);
}
