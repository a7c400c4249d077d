import { sql, type Kysely } from 'kysely';

/**
 * Plans keep only their input: the result is evaluated again whenever a plan is read, so a change
 * to the computation never leaves a stale result behind, and plan lists stay small.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('power_plans').dropColumn('result').execute();
}

/** The column comes back empty ('{}'): results were never the record, their inputs are. */
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('power_plans').addColumn('result', 'text', (c) => c.notNull().defaultTo(sql`'{}'`)).execute();
}
