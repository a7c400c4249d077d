import { sql, type Kysely } from 'kysely';

/**
 * Serial numbers are found through the full-text index over builds (migrations 015, 049: any piece
 * of a number, in any case), and a number is checked for a second use through the unique (SKU,
 * serial) index; the case-free index of 004 is read by nothing. On 200 shops it held every one of
 * 9.6 million build lines (114 MB) and took a write for each line added.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`drop index build_items_serial_nocase`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`create index build_items_serial_nocase on build_items (serial_number collate nocase)`.execute(db);
}
