import type { Kysely } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('claim_evidence')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('claim_id', 'integer', (c) => c.notNull().references('warranty_claims.id').onDelete('cascade'))
    .addColumn('file_name', 'text', (c) => c.notNull())
    .addColumn('stored_name', 'text', (c) => c.notNull().unique())
    .addColumn('content_type', 'text', (c) => c.notNull())
    .addColumn('size_bytes', 'integer', (c) => c.notNull())
    .addColumn('has_thumbnail', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('uploaded_by', 'integer', (c) => c.references('users.id'))
    .addColumn('uploaded_at', 'text', (c) => c.notNull())
    .addColumn('deleted_at', 'text')
    .addColumn('deleted_by', 'integer', (c) => c.references('users.id'))
    .addColumn('delete_reason', 'text')
    .execute();
  await db.schema.createIndex('claim_evidence_claim').on('claim_evidence').column('claim_id').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('claim_evidence').execute();
}
