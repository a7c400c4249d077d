import { sql, type Kysely } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('vendors')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('name', 'text', (c) => c.notNull().unique())
    .addColumn('rma_email', 'text', (c) => c.notNull())
    .addColumn('default_warranty_months', 'integer', (c) => c.notNull())
    .addColumn('notes', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('active', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('version', 'integer', (c) => c.notNull().defaultTo(1))
    .execute();

  await db.schema
    .createTable('catalog_items')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('sku', 'text', (c) => c.notNull().unique())
    .addColumn('vendor_id', 'integer', (c) => c.notNull().references('vendors.id'))
    .addColumn('category', 'text', (c) => c.notNull())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('specs', 'text', (c) => c.notNull().defaultTo('{}'))
    .addColumn('serialized', 'integer', (c) => c.notNull())
    .addColumn('unit_cost_cents', 'integer', (c) => c.notNull().check(sql`unit_cost_cents >= 0`))
    .addColumn('unit_price_cents', 'integer', (c) => c.notNull().check(sql`unit_price_cents >= 0`))
    .addColumn('warranty_months', 'integer', (c) => c.notNull())
    .addColumn('active', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('version', 'integer', (c) => c.notNull().defaultTo(1))
    .execute();

  await db.schema
    .createTable('customers')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('location_id', 'integer', (c) => c.notNull().references('locations.id'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('email', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('phone', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('address_line1', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('address_line2', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('city', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('region', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('postal_code', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('notes', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('version', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('customers_location').on('customers').columns(['location_id', 'name']).execute();

  await db.schema
    .createTable('vehicles')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('customer_id', 'integer', (c) => c.notNull().references('customers.id'))
    .addColumn('location_id', 'integer', (c) => c.notNull().references('locations.id'))
    .addColumn('year', 'integer', (c) => c.notNull())
    .addColumn('body_style', 'text', (c) => c.notNull())
    .addColumn('make', 'text', (c) => c.notNull())
    .addColumn('model', 'text', (c) => c.notNull())
    .addColumn('notes', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('version', 'integer', (c) => c.notNull().defaultTo(1))
    .execute();
  await db.schema.createIndex('vehicles_customer').on('vehicles').column('customer_id').execute();

  await db.schema
    .createTable('builds')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('location_id', 'integer', (c) => c.notNull().references('locations.id'))
    .addColumn('sequence', 'integer', (c) => c.notNull())
    .addColumn('number', 'text', (c) => c.notNull().unique())
    .addColumn('customer_id', 'integer', (c) => c.notNull().references('customers.id'))
    .addColumn('vehicle_id', 'integer', (c) => c.notNull().references('vehicles.id'))
    .addColumn('status', 'text', (c) =>
      c.notNull().check(sql`status in ('draft','quoted','booked','in_bay','quality_check','delivered','cancelled')`),
    )
    .addColumn('lead_technician_id', 'integer', (c) => c.references('users.id'))
    .addColumn('booked_for', 'text')
    .addColumn('started_at', 'text')
    .addColumn('delivered_at', 'text')
    .addColumn('labor_hours', 'real', (c) => c.notNull().defaultTo(0))
    .addColumn('labor_rate_cents', 'integer', (c) => c.notNull())
    .addColumn('labor_cents', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('parts_price_cents', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('parts_cost_cents', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('total_cents', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('notes', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('version', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('updated_at', 'text', (c) => c.notNull())
    .addColumn('created_by', 'integer', (c) => c.references('users.id'))
    .addUniqueConstraint('builds_location_sequence', ['location_id', 'sequence'])
    .execute();
  await db.schema.createIndex('builds_location_status').on('builds').columns(['location_id', 'status']).execute();
  await db.schema.createIndex('builds_delivered').on('builds').columns(['location_id', 'delivered_at']).execute();

  await db.schema
    .createTable('build_items')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('build_id', 'integer', (c) => c.notNull().references('builds.id').onDelete('cascade'))
    .addColumn('catalog_item_id', 'integer', (c) => c.notNull().references('catalog_items.id'))
    .addColumn('sku', 'text', (c) => c.notNull())
    .addColumn('quantity', 'integer', (c) => c.notNull().check(sql`quantity >= 1`))
    .addColumn('serial_number', 'text')
    .addColumn('unit_price_cents', 'integer', (c) => c.notNull())
    .addColumn('unit_cost_cents', 'integer', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('build_items_build').on('build_items').column('build_id').execute();
  // A serial number names one unit of one SKU across the whole network.
  await sql`create unique index build_items_serial on build_items (sku, serial_number) where serial_number is not null`.execute(db);
  await db.schema.createIndex('build_items_serial_search').on('build_items').column('serial_number').execute();

  await db.schema
    .createTable('build_events')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('build_id', 'integer', (c) => c.notNull().references('builds.id').onDelete('cascade'))
    .addColumn('at', 'text', (c) => c.notNull())
    .addColumn('actor_id', 'integer', (c) => c.references('users.id'))
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind in ('status', 'correction')`))
    .addColumn('from_status', 'text')
    .addColumn('to_status', 'text')
    .addColumn('note', 'text', (c) => c.notNull().defaultTo(''))
    .execute();
  await db.schema.createIndex('build_events_build').on('build_events').column('build_id').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const table of ['build_events', 'build_items', 'builds', 'vehicles', 'customers', 'catalog_items', 'vendors']) {
    await db.schema.dropTable(table).execute();
  }
}
