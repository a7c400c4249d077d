import { sql, type Kysely } from 'kysely';

/**
 * At most one unfinished export per person, held by the database: the app's processes each check
 * and insert on their own, so only a unique index stops two of them starting one each. Exports
 * left unfinished are failed first, as start-up would fail them (no job runs during migrations).
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`update exports set status = 'failed', error = 'Busbar restarted while this export was being made. Run it again.',
      finished_at = strftime('%Y-%m-%dT%H:%M:%fZ', 'now')
    where status in ('queued', 'running')`.execute(db);
  await sql`create unique index exports_one_unfinished on exports (created_by) where status in ('queued', 'running')`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index exports_one_unfinished`.execute(db);
}
