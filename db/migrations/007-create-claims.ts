import { sql, type Kysely } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  // Claims a location lead may approve alone; above it the regional manager (set by the owner).
  await db.schema.alterTable('locations').addColumn('claim_approval_limit_cents', 'integer', (c) => c.notNull().defaultTo(50_000)).execute();

  await db.schema
    .createTable('warranty_claims')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('location_id', 'integer', (c) => c.notNull().references('locations.id'))
    .addColumn('sequence', 'integer', (c) => c.notNull())
    .addColumn('number', 'text', (c) => c.notNull().unique())
    .addColumn('build_id', 'integer', (c) => c.notNull().references('builds.id'))
    .addColumn('build_item_id', 'integer', (c) => c.notNull().references('build_items.id'))
    .addColumn('failed_on', 'text', (c) => c.notNull())
    .addColumn('failure_mode', 'text', (c) => c.notNull())
    .addColumn('coverage', 'text', (c) => c.notNull().check(sql`coverage in ('vendor_defect','workmanship','goodwill')`))
    .addColumn('symptoms', 'text', (c) => c.notNull())
    .addColumn('found_how', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('labor_hours', 'real', (c) => c.notNull().defaultTo(0))
    .addColumn('out_of_warranty', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('status', 'text', (c) =>
      c.notNull().check(sql`status in ('logged','evidence_ready','sent_to_vendor','approved','denied','credited','closed')`),
    )
    .addColumn('vendor_rma_number', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('credit_requested_cents', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('credit_approved_cents', 'integer')
    .addColumn('credit_received_cents', 'integer')
    .addColumn('created_by', 'integer', (c) => c.references('users.id'))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('updated_at', 'text', (c) => c.notNull())
    .addColumn('version', 'integer', (c) => c.notNull().defaultTo(1))
    .addUniqueConstraint('warranty_claims_location_sequence', ['location_id', 'sequence'])
    .execute();
  // The queue: a location's claims by status, oldest first; and the claims of a build or a unit.
  await db.schema.createIndex('warranty_claims_queue').on('warranty_claims').columns(['location_id', 'status', 'created_at']).execute();
  await db.schema.createIndex('warranty_claims_status').on('warranty_claims').columns(['status', 'created_at']).execute();
  await db.schema.createIndex('warranty_claims_build').on('warranty_claims').column('build_id').execute();
  await db.schema.createIndex('warranty_claims_item').on('warranty_claims').column('build_item_id').execute();

  await db.schema
    .createTable('claim_events')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('claim_id', 'integer', (c) => c.notNull().references('warranty_claims.id').onDelete('cascade'))
    .addColumn('at', 'text', (c) => c.notNull())
    .addColumn('actor_id', 'integer', (c) => c.references('users.id'))
    .addColumn('from_status', 'text')
    .addColumn('to_status', 'text', (c) => c.notNull())
    .addColumn('note', 'text', (c) => c.notNull().defaultTo(''))
    .execute();
  await db.schema.createIndex('claim_events_claim').on('claim_events').column('claim_id').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('claim_events').execute();
  await db.schema.dropTable('warranty_claims').execute();
  await db.schema.alterTable('locations').dropColumn('claim_approval_limit_cents').execute();
}
