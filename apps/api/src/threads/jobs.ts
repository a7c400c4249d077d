import { openDatabase, type Db } from '@busbar/db';
import { rollupReportJson } from '../queries/rollups-report.ts';
import { reliabilityDetail } from '../reliability/detail.ts';
import { reliabilityList } from '../reliability/list.ts';
import { utf8Of } from '../utf8.ts';
import { encodedJson, type EncodedJson } from '../web/compress.ts';
import type { Encoding } from '../web/encoding.ts';

export { importBuilds } from '../imports/import-job.ts';

/**
 * The long work that runs on the background thread (background.ts). Each read is given the
 * database file and the encoding the client accepts first, and answers the JSON to send as UTF-8
 * bytes, compressed here, which the thread hands over without a copy: an owner's year of roll-ups
 * is 3 MB, which as text was copied across (25 ms), and as objects would cost the request thread
 * more. The reads keep one connection, for reading only, to the file last asked about; an import
 * opens its own, to write.
 */
let open: { file: string; db: Db } | null = null;

function connection(file: string): Db {
  if (open?.file === file) return open.db;
  void open?.db.destroy();
  open = { file, db: openDatabase(file, { queryOnly: true }) };
  return open.db;
}

/** A read on the file's connection, its answer as JSON bytes (of its own: see utf8Of) compressed with the encoding the client accepts. */
const onFile =
  <A extends unknown[], R>(read: (db: Db, ...args: A) => Promise<R>, asBytes: (answer: R) => Uint8Array) =>
  async (file: string, encoding: Encoding | null, ...args: A): Promise<EncodedJson> =>
    encodedJson(asBytes(await read(connection(file), ...args)), encoding);

const asJson = (answer: unknown) => utf8Of([JSON.stringify(answer)]);
export const reliabilityListOf = onFile(reliabilityList, asJson);
export const reliabilityDetailOf = onFile(reliabilityDetail, asJson);
export const rollupReportOf = onFile(rollupReportJson, (bytes) => bytes);
export { runExport } from '../exports/export-job.ts';
