import { sql, type Kysely } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('regions')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('code', 'text', (c) => c.notNull().unique())
    .addColumn('name', 'text', (c) => c.notNull())
    .execute();

  await db.schema
    .createTable('locations')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('region_id', 'integer', (c) => c.notNull().references('regions.id'))
    .addColumn('code', 'text', (c) => c.notNull().unique())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('time_zone', 'text', (c) => c.notNull())
    .addColumn('labor_rate_cents', 'integer', (c) => c.notNull().check(sql`labor_rate_cents >= 0`))
    .addColumn('royalty_basis_points', 'integer', (c) =>
      c.notNull().check(sql`royalty_basis_points between 0 and 10000`),
    )
    .execute();

  await db.schema
    .createTable('users')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('email', 'text', (c) => c.notNull().unique())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('password_hash', 'text')
    .addColumn('status', 'text', (c) => c.notNull().check(sql`status in ('active', 'invited', 'inactive')`))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('last_sign_in_at', 'text')
    .execute();

  await db.schema
    .createTable('role_assignments')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('user_id', 'integer', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('role', 'text', (c) => c.notNull())
    .addColumn('scope', 'text', (c) => c.notNull().check(sql`scope in ('network', 'region', 'location')`))
    .addColumn('region_id', 'integer', (c) => c.references('regions.id'))
    .addColumn('location_id', 'integer', (c) => c.references('locations.id'))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('created_by', 'integer', (c) => c.references('users.id'))
    .addCheckConstraint(
      'role_assignment_scope',
      sql`(scope = 'network' and region_id is null and location_id is null)
        or (scope = 'region' and region_id is not null and location_id is null)
        or (scope = 'location' and location_id is not null and region_id is null)`,
    )
    .execute();
  // One role once per scope; coalesce so the network scope (both null) is unique too.
  await sql`create unique index role_assignments_unique
    on role_assignments (user_id, role, coalesce(region_id, 0), coalesce(location_id, 0))`.execute(db);
  await db.schema.createIndex('role_assignments_location').on('role_assignments').column('location_id').execute();

  await db.schema
    .createTable('sessions')
    .addColumn('sid', 'text', (c) => c.primaryKey())
    .addColumn('user_id', 'integer', (c) => c.references('users.id').onDelete('cascade'))
    .addColumn('data', 'text', (c) => c.notNull())
    .addColumn('expires_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('sessions_user').on('sessions').column('user_id').execute();
  await db.schema.createIndex('sessions_expires').on('sessions').column('expires_at').execute();

  await db.schema
    .createTable('audit_log')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('at', 'text', (c) => c.notNull())
    .addColumn('actor_id', 'integer', (c) => c.references('users.id'))
    .addColumn('action', 'text', (c) => c.notNull())
    .addColumn('entity', 'text', (c) => c.notNull())
    .addColumn('entity_id', 'integer')
    .addColumn('before', 'text')
    .addColumn('after', 'text')
    .execute();
  await db.schema.createIndex('audit_log_entity').on('audit_log').columns(['entity', 'entity_id']).execute();

  await db.schema
    .createTable('invites')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('user_id', 'integer', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('created_by', 'integer', (c) => c.references('users.id'))
    .addColumn('expires_at', 'text', (c) => c.notNull())
    .addColumn('used_at', 'text')
    .execute();

  await db.schema
    .createTable('mail_log')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('sent_at', 'text', (c) => c.notNull())
    .addColumn('to_address', 'text', (c) => c.notNull())
    .addColumn('subject', 'text', (c) => c.notNull())
    .addColumn('text', 'text', (c) => c.notNull())
    .addColumn('status', 'text', (c) => c.notNull().check(sql`status in ('sent', 'failed')`))
    .addColumn('error', 'text')
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const table of ['mail_log', 'invites', 'audit_log', 'sessions', 'role_assignments', 'users', 'locations', 'regions']) {
    await db.schema.dropTable(table).execute();
  }
}
