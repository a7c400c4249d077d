import { sql, type Kysely } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  // A plan belongs to one build, or to none yet (a quick plan from a consultation).
  await db.schema
    .createTable('power_plans')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('build_id', 'integer', (c) => c.unique().references('builds.id'))
    .addColumn('location_id', 'integer', (c) => c.notNull().references('locations.id'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('input', 'text', (c) => c.notNull())
    .addColumn('result', 'text', (c) => c.notNull())
    .addColumn('version', 'integer', (c) => c.notNull().defaultTo(1).check(sql`version >= 1`))
    .addColumn('created_by', 'integer', (c) => c.references('users.id'))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('updated_at', 'text', (c) => c.notNull())
    .addColumn('updated_by', 'integer', (c) => c.references('users.id'))
    .execute();
  await db.schema.createIndex('power_plans_location').on('power_plans').columns(['location_id', 'updated_at']).execute();

  await db.schema
    .createTable('power_plan_revisions')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('plan_id', 'integer', (c) => c.notNull().references('power_plans.id').onDelete('cascade'))
    .addColumn('version', 'integer', (c) => c.notNull())
    .addColumn('input', 'text', (c) => c.notNull())
    .addColumn('saved_at', 'text', (c) => c.notNull())
    .addColumn('saved_by', 'integer', (c) => c.notNull().references('users.id'))
    .addColumn('note', 'text', (c) => c.notNull().defaultTo(''))
    .addUniqueConstraint('power_plan_revisions_version', ['plan_id', 'version'])
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const table of ['power_plan_revisions', 'power_plans']) {
    await db.schema.dropTable(table).execute();
  }
}
