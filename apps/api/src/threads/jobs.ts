import { openDatabase, type Db } from '@busbar/db';
import { rollupReport } from '../queries/rollups-report.ts';
import { reliabilityDetail } from '../reliability/detail.ts';
import { reliabilityList } from '../reliability/list.ts';

export { importBuilds } from '../imports/import-job.ts';

/**
 * The long work that runs on the background thread (background.ts). Each read is given the
 * database file first and answers the JSON text to send: an owner's year of roll-ups is 3 MB, and
 * turning it into objects on the request thread and back into text would cost that thread 25 ms.
 * The reads keep one connection, for reading only, to the file last asked about; an import opens
 * its own, to write.
 */
let open: { file: string; db: Db } | null = null;

function connection(file: string): Db {
  if (open?.file === file) return open.db;
  void open?.db.destroy();
  open = { file, db: openDatabase(file, { queryOnly: true }) };
  return open.db;
}

const onFile =
  <A extends unknown[]>(read: (db: Db, ...args: A) => Promise<unknown>) =>
  async (file: string, ...args: A): Promise<string> =>
    JSON.stringify(await read(connection(file), ...args));

export const reliabilityListOf = onFile(reliabilityList);
export const reliabilityDetailOf = onFile(reliabilityDetail);
export const rollupReportOf = onFile(rollupReport);
