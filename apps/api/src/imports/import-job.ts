import { openDatabase } from '@busbar/db';
import type { ImportResult } from '@busbar/shared';
import { checkImport } from './check-rows.ts';
import { writeImport, type ImportLocation } from './write-rows.ts';

export interface ImportJob {
  databaseFile: string;
  location: ImportLocation;
  csv: string;
  dryRun: boolean;
  actorId: number;
  at: string;
}

/**
 * Checks an import and, when every row passes and it is not a dry run, writes it whole, a batch
 * at a time (write-rows.ts), on a connection of its own (it runs on the background thread: see threads/background.ts).
 */
export async function importBuilds(job: ImportJob): Promise<ImportResult> {
  const db = openDatabase(job.databaseFile);
  try {
    const { results, rows } = await checkImport(db, job.location, job.csv, job.at);
    const ok = results.length > 0 && rows.length === results.length && results.every((r) => Object.keys(r.errors).length === 0);
    let created = 0;
    if (ok && !job.dryRun) created = await writeImport(db, job.location, rows, job.actorId, job.at);
    return { ok, created, rows: results };
  } finally {
    await db.destroy();
  }
}
