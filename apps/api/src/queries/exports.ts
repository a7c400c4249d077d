import type { Db } from '@busbar/db';
import type { ExportJob, ExportSheet, Page } from '@busbar/shared';
import type { Insertable } from 'kysely';
import type { Database } from '@busbar/db';
import { cappedCount, offsetOf } from './paging.ts';

const jobs = (db: Db) =>
  db
    .selectFrom('exports as e')
    .innerJoin('users as u', 'u.id', 'e.createdBy')
    .select([
      'e.id', 'e.kind', 'e.month', 'e.throughMonth', 'e.scopeLabel', 'e.locationCount', 'e.format', 'e.sheet', 'e.status', 'e.rowsDone', 'e.rowsTotal',
      'e.error', 'e.fileName', 'e.fileBytes', 'e.checksum', 'e.createdBy as createdById', 'u.name as createdByName', 'e.createdAt', 'e.finishedAt',
    ]);

type JobRow = Awaited<ReturnType<ReturnType<typeof jobs>['executeTakeFirstOrThrow']>>;
const asJob = (row: JobRow): ExportJob => ({ ...row, sheet: row.sheet as ExportSheet | null });

export async function insertExport(db: Db, values: Insertable<Database['exports']>): Promise<number> {
  const row = await db.insertInto('exports').values(values).returning('id').executeTakeFirstOrThrow();
  return row.id;
}

/** An export with the shops it covers (null: the whole network). */
export async function exportById(db: Db, id: number): Promise<(ExportJob & { locationIds: number[] | null }) | undefined> {
  const row = await jobs(db).select('e.locationIds').where('e.id', '=', id).executeTakeFirst();
  if (!row) return undefined;
  const { locationIds, ...job } = row;
  return { ...asJob(job), locationIds: locationIds === null ? null : (JSON.parse(locationIds) as number[]) };
}

/** One page of the export history, newest first: one person's exports, or everyone's (`by` null). */
export async function listExports(db: Db, by: number | null, { page, pageSize }: { page: number; pageSize: number }): Promise<Page<ExportJob>> {
  let rows = jobs(db).orderBy('e.id', 'desc').limit(pageSize).offset(offsetOf(page, pageSize));
  let all = db.selectFrom('exports').select('id');
  if (by !== null) {
    rows = rows.where('e.createdBy', '=', by);
    all = all.where('createdBy', '=', by);
  }
  const [items, count] = await Promise.all([rows.execute(), cappedCount(db, all)]);
  return { items: items.map(asJob), ...count, page, pageSize };
}

/** Exports a stopped app left unfinished (their jobs died with it) are failed, saying so; at start-up, before any process runs jobs. */
export async function failUnfinishedExports(db: Db, at: Date): Promise<void> {
  await db
    .updateTable('exports')
    .set({ status: 'failed', error: 'Busbar restarted while this export was being made. Run it again.', finishedAt: at.toISOString() })
    .where('status', 'in', ['queued', 'running'])
    .execute();
}
