import type { Db } from '@busbar/db';
import { sql } from 'kysely';

/** Runs `work` inside a savepoint and takes back everything it wrote, whatever happens. */
export async function rolledBack<T>(db: Db, work: () => Promise<T>): Promise<T> {
  await sql.raw('savepoint work').execute(db);
  try {
    return await work();
  } finally {
    await sql.raw('rollback to work').execute(db);
    await sql.raw('release work').execute(db);
  }
}

/** What `read` finds after the kept tables were refilled from scratch by `script` (taken back after). */
export function afterRefill<T>(db: Db, script: string, read: (db: Db) => Promise<T>): Promise<T> {
  return rolledBack(db, async () => {
    for (const statement of script.split(';').filter((s) => s.trim())) await sql.raw(statement).execute(db);
    return read(db);
  });
}
