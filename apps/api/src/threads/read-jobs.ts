import { openDatabase, type Db } from '@busbar/db';
import { rollupReport } from '../queries/rollups-report.ts';
import { reliabilityDetail } from '../reliability/detail.ts';
import { reliabilityList } from '../reliability/list.ts';

/**
 * The long reads that run on the read thread (read-thread.ts), each given the database file first.
 * The thread keeps one connection, for reading only, to the file it was last asked about.
 */
let open: { file: string; db: Db } | null = null;

function connection(file: string): Db {
  if (open?.file === file) return open.db;
  void open?.db.destroy();
  open = { file, db: openDatabase(file, { queryOnly: true }) };
  return open.db;
}

const onFile =
  <A extends unknown[], R>(read: (db: Db, ...args: A) => Promise<R>) =>
  (file: string, ...args: A): Promise<R> =>
    read(connection(file), ...args);

export const reliabilityListOf = onFile(reliabilityList);
export const reliabilityDetailOf = onFile(reliabilityDetail);
export const rollupReportOf = onFile(rollupReport);
