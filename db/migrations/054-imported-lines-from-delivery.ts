import { sql, type Kysely } from 'kysely';

/**
 * The lines of an imported build were recorded as added at the import, after the build's delivery:
 * its units counted as installed the day of the import (reliability) and a claim could give no
 * failure before that day. They were in the build when it was delivered. An imported build is told
 * by its delivery before it was recorded; its lines, by being recorded with it in the same instant.
 * The reliability tables follow through their triggers.
 */
const IMPORTED = `select i.id from build_items i join builds b on b.id = i.build_id
  where b.delivered_at is not null and b.delivered_at < b.created_at`;

export async function up(db: Kysely<any>): Promise<void> {
  await sql.raw(`update build_items set created_at = (select b.delivered_at from builds b where b.id = build_items.build_id)
    where id in (${IMPORTED} and i.created_at = b.created_at)`).execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql.raw(`update build_items set created_at = (select b.created_at from builds b where b.id = build_items.build_id)
    where id in (${IMPORTED} and i.created_at = b.delivered_at)`).execute(db);
}
