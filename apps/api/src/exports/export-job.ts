import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { mkdir, rename, rm, stat } from 'node:fs/promises';
import { join } from 'node:path';
import { pipeline } from 'node:stream/promises';
import { openDatabase, type Database, type Db } from '@busbar/db';
import { EXPORT_SHEET_NAMES, type ExportSheet } from '@busbar/shared';
import { sql, type Updateable } from 'kysely';
import type { LocationScope } from '../access/locations.ts';
import { monthClose } from '../queries/month-close.ts';
import { monthsFrom } from '../queries/month-finals.ts';
import { shown } from './columns.ts';
import { monthCloseSheets, type ClosedMonth } from './sheets.ts';
import { csvWriter } from './write-csv.ts';
import { xlsxWriter } from './write-xlsx.ts';

/** An export to make, as the request that asked for it worked it out (routes/exports.ts). */
export interface ExportSpec {
  databaseFile: string;
  /** The folder export files are kept in. */
  folder: string;
  id: number;
  month: string;
  throughMonth: string;
  scope: LocationScope;
  format: 'xlsx' | 'csv';
  sheet: ExportSheet | null;
  /** Fields the person may not read ('Subject.field'): their columns are left out. */
  hidden: string[];
  /** When it was asked for (ISO): the month close as it stood then decides which months have ended. */
  at: string;
}

/** The file an export is kept in, in the data folder's exports folder. */
export const exportFile = (folder: string, id: number, format: string) => join(folder, `${id}.${format}`);

/** Progress is written at most this often (ms): each write takes the database's write lock. */
const PROGRESS_EVERY_MS = 250;

/**
 * Makes an export on the background thread: every sheet read in one read transaction (so its
 * totals agree with each other however the month changes meanwhile), written a batch at a time to
 * a file beside its final name, with progress in the export's row; then named, measured and
 * checksummed. A failure is kept with its reason, and the partial file removed.
 */
export async function runExport(spec: ExportSpec): Promise<void> {
  const store = openDatabase(spec.databaseFile);
  const read = openDatabase(spec.databaseFile, { queryOnly: true });
  const file = exportFile(spec.folder, spec.id, spec.format);
  const part = `${file}.part`;
  const mark = (values: Updateable<Database['exports']>) => store.updateTable('exports').set(values).where('id', '=', spec.id).execute();
  try {
    await mkdir(spec.folder, { recursive: true });
    await mark({ status: 'running' });
    // A plain (deferred) BEGIN: the app's transactions take the write lock, which a reading connection may not.
    await read.connection().execute(async (trx) => {
      await sql`begin`.execute(trx);
      const closes = await closedMonths(trx, spec);
      const range = { db: trx, first: `${spec.month}-01`, last: `${spec.throughMonth}-31`, scope: spec.scope };
      const sheets = monthCloseSheets(range, closes).filter((s) => spec.format === 'xlsx' || s.key === (spec.sheet ?? 'summary'));
      let rowsTotal = 0;
      for (const s of sheets) rowsTotal += await s.count();
      await mark({ rowsTotal });
      let [rowsDone, lastWritten] = [0, Date.now()];
      const wrote = async (rows: number) => {
        rowsDone += rows;
        if (Date.now() - lastWritten >= PROGRESS_EVERY_MS) {
          lastWritten = Date.now();
          await mark({ rowsDone });
        }
        // Lets the thread's other work (a report someone is waiting for) run between batches.
        await new Promise((resolve) => setImmediate(resolve));
      };
      const writer = spec.format === 'xlsx' ? await xlsxWriter(part) : csvWriter(part);
      for (const s of sheets) await writer.sheet(EXPORT_SHEET_NAMES[s.key], shown(s.columns, spec.hidden), s.batches(), wrote);
      await writer.finish();
      await sql`commit`.execute(trx);
      await rename(part, file);
      await mark({ status: 'done', rowsDone, fileBytes: (await stat(file)).size, checksum: await sha256Of(file), finishedAt: new Date().toISOString() });
    });
  } catch (error) {
    // Where the folder itself failed there is no partial file to remove, and that failure is the one to report.
    await rm(part, { force: true }).catch(() => undefined);
    await mark({ status: 'failed', error: inWords(error), finishedAt: new Date().toISOString() });
  } finally {
    await Promise.all([store.destroy(), read.destroy()]);
  }
}

/** Every month of the export at every location of its scope, as the month close has it, with the shop's code and name. */
async function closedMonths(db: Db, spec: ExportSpec): Promise<ClosedMonth[]> {
  const shops = new Map((await db.selectFrom('locations').select(['id', 'code', 'name']).execute()).map((l) => [l.id, l]));
  const closes: ClosedMonth[] = [];
  for (const month of monthsFrom(spec.month, spec.throughMonth)) {
    const close = await monthClose(db, month, spec.scope, new Date(spec.at));
    for (const l of close.locations) closes.push({ ...l, month, shop: shops.get(l.locationId)!.code, shopName: shops.get(l.locationId)!.name });
  }
  return closes;
}

async function sha256Of(file: string): Promise<string> {
  const hash = createHash('sha256');
  await pipeline(createReadStream(file), hash);
  return hash.digest('hex');
}

/** Why an export failed, for the person who asked for it. */
function inWords(error: unknown): string {
  const code = (error as { code?: string }).code;
  if (code === 'ENOSPC') return 'The server ran out of disk space while writing the file.';
  if (code === 'EACCES' || code === 'EPERM' || code === 'EEXIST' || code === 'ENOTDIR') return 'Busbar could not write to its exports folder on the server.';
  return `The export stopped: ${error instanceof Error ? error.message : String(error)}`;
}
