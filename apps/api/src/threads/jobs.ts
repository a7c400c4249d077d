import { openDatabase, type Db } from '@busbar/db';
import { utf8Of } from '../utf8.ts';
import { rollupReportJson } from '../queries/rollups-report.ts';
import { reliabilityDetail } from '../reliability/detail.ts';
import { reliabilityList } from '../reliability/list.ts';

export { importBuilds } from '../imports/import-job.ts';

/**
 * The long work that runs on the background thread (background.ts). Each read is given the
 * database file first and answers the JSON to send as UTF-8 bytes, which the thread hands over
 * without a copy: an owner's year of roll-ups is 3 MB, which as text was copied across (25 ms),
 * and as objects would cost the request thread more. The reads keep one connection, for reading
 * only, to the file last asked about; an import opens its own, to write.
 */
let open: { file: string; db: Db } | null = null;

function connection(file: string): Db {
  if (open?.file === file) return open.db;
  void open?.db.destroy();
  open = { file, db: openDatabase(file, { queryOnly: true }) };
  return open.db;
}

/** A read on the file's connection, its answer as JSON bytes (of its own: see utf8Of). */
const onFile =
  <A extends unknown[], R>(read: (db: Db, ...args: A) => Promise<R>, asBytes: (answer: R) => Uint8Array) =>
  async (file: string, ...args: A): Promise<Uint8Array> =>
    asBytes(await read(connection(file), ...args));

const asJson = (answer: unknown) => utf8Of([JSON.stringify(answer)]);
export const reliabilityListOf = onFile(reliabilityList, asJson);
export const reliabilityDetailOf = onFile(reliabilityDetail, asJson);
export const rollupReportOf = onFile(rollupReportJson, (bytes) => bytes);
export { runExport } from '../exports/export-job.ts';
