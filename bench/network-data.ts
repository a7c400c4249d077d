import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DEMO_PASSWORD, migrateToLatest, openDatabase, seedNetwork } from '@busbar/db';
import { hashPassword } from '../apps/api/src/auth/password.ts';
import { loadConfig } from '../apps/api/src/config.ts';
import { closeGeneratedMonths } from '../apps/api/src/demo-closes.ts';
import { ensureDemoData } from '../apps/api/src/demo.ts';
import { progressBar } from '../apps/api/src/progress.ts';

export interface DataSize {
  label: string;
  locations: number;
  builds: number;
  buildItems: number;
  claims: number;
  auditRows: number;
  finalMonths: number;
  /** Seconds the generator took (also for a database an earlier run made), or null when not known. */
  generatedSeconds: number | null;
}

/** What a data folder holds, counted from its database. */
export async function sizeOf(dir: string, label: string, generatedSeconds: number | null): Promise<DataSize> {
  const db = openDatabase(join(dir, 'busbar.sqlite'));
  const count = async (table: 'locations' | 'builds' | 'buildItems' | 'warrantyClaims' | 'auditLog' | 'monthCloses') =>
    Number((await db.selectFrom(table).select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow()).n);
  const size = { label, locations: await count('locations'), builds: await count('builds'), buildItems: await count('buildItems'), claims: await count('warrantyClaims'), auditRows: await count('auditLog'), finalMonths: await count('monthCloses'), generatedSeconds };
  await db.destroy();
  return size;
}

/**
 * A new data folder with the demo network, seeded here as `pnpm db:reset` does, so the app's
 * figures (its peak memory above all) are of serving it, not of making it.
 */
export async function demoData(): Promise<string> {
  const dir = mkdtempSync(join(tmpdir(), 'busbar-bench-demo-'));
  const db = openDatabase(join(dir, 'busbar.sqlite'));
  await migrateToLatest(db);
  await ensureDemoData(db, loadConfig().scryptLogN, new Date(), dir);
  await db.destroy();
  return dir;
}

/**
 * A data folder with a generated network of the size asked for (pnpm demo:network's generator),
 * made fresh unless `reuse`; how long the generator took is kept beside the database.
 */
export async function networkData(locations: number, years: number, reuse: boolean): Promise<{ dir: string; generatedSeconds: number | null; reused: boolean }> {
  const dir = join(tmpdir(), `busbar-bench-${locations}x${years}`);
  const timing = join(dir, 'generated-seconds');
  if (reuse && existsSync(join(dir, 'busbar.sqlite'))) {
    return { dir, generatedSeconds: existsSync(timing) ? Number(readFileSync(timing, 'utf8')) : null, reused: true };
  }
  rmSync(dir, { recursive: true, force: true });
  mkdirSync(dir, { recursive: true });
  const started = performance.now();
  const now = new Date();
  const bar = progressBar(`generating ${locations} × ${years}`, 1);
  await seedNetwork({
    file: join(dir, 'busbar.sqlite'),
    locations,
    years,
    now,
    passwordHash: await hashPassword(DEMO_PASSWORD, loadConfig().scryptLogN),
    onProgress: ({ days, totalDays, builds, indexing }) =>
      indexing ? bar.end(`${builds.toLocaleString('en-US')} builds; building indexes…`) : bar.update(days / totalDays, `${builds.toLocaleString('en-US')} builds`),
  });
  const closing = progressBar('closing months', 1);
  const closed = await closeGeneratedMonths(join(dir, 'busbar.sqlite'), now, (done, of) => closing.update(done / of, `${done} of ${of}`));
  closing.end(`${closed.toLocaleString('en-US')} months final`);
  const generatedSeconds = (performance.now() - started) / 1000;
  writeFileSync(timing, `${generatedSeconds.toFixed(0)}\n`);
  return { dir, generatedSeconds, reused: false };
}
