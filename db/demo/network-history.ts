/**
 * A network of any size with the demo's kind of history (shop-history.ts, history-rows.ts), power
 * plans (plans.ts) and warranty claims (claims-rows.ts, no evidence files), for measuring Busbar at
 * scale: streamed a week at a time into SQLite through prepared statements, one transaction a week,
 * with the secondary indexes built once at the end (bulk.ts).
 */
import SQLite from 'better-sqlite3';
import { migrateToLatest, openDatabase } from '../connect.ts';
import { bulkInserter, dropSecondaryIndexes } from './bulk.ts';
import { claimContext } from './claims-context.ts';
import { claimMaker, type ClaimRows } from './claims-rows.ts';
import { seedDemoNetwork } from './generate.ts';
import { historyRowMaker, type HistoryRows } from './history-rows.ts';
import { CLAIM_STREAM, insertCatalog, loadShops } from './history.ts';
import { nextIds } from './insert.ts';
import { PLAN_STREAM, planMaker, type PlanRows } from './plans.ts';
import { generateNetwork } from './network-shops.ts';
import { seededRandom } from './random.ts';
import { shopDays, type SimBuild, type SimCustomer } from './shop-history.ts';

export interface NetworkOptions {
  file: string;
  locations: number;
  years: number;
  now: Date;
  passwordHash: string;
  seed?: number;
  /** Called after each week: days simulated of `totalDays`, builds written so far; `indexing` once the rows are in. */
  onProgress?: (progress: { days: number; totalDays: number; builds: number; indexing: boolean }) => void;
}

export interface NetworkCounts {
  locations: number;
  customers: number;
  vehicles: number;
  builds: number;
  buildItems: number;
  buildEvents: number;
  auditLog: number;
  warrantyClaims: number;
  claimEvents: number;
  powerPlans: number;
}

const DAYS_PER_BATCH = 7;
const TABLES = ['customers', 'vehicles', 'builds', 'buildItems', 'buildEvents', 'auditLog'] as const satisfies readonly (keyof HistoryRows)[];
const CLAIM_TABLES = ['buildItems', 'buildEvents', 'warrantyClaims', 'claimEvents'] as const satisfies readonly (keyof ClaimRows)[];
const PLAN_TABLES = ['powerPlans', 'powerPlanRevisions', 'planMargins'] as const satisfies readonly (keyof PlanRows)[];
/** A build of a later batch is made at most about a day before the last one of this batch (time zones), so claims logged two days before it are final. */
const SETTLED_MS = 2 * 86_400_000;

/** Fills a freshly created database file with a generated network and its history up to `now`. */
export async function seedNetwork(options: NetworkOptions): Promise<NetworkCounts> {
  const seed = options.seed ?? 20261202;
  const historyDays = Math.round(options.years * 365.25);
  const network = generateNetwork(seededRandom(seed ^ 0x0b5e_7a11), options.locations, historyDays);
  const db = openDatabase(options.file);
  await migrateToLatest(db);
  await seedDemoNetwork(db, { passwordHash: options.passwordHash, now: options.now, seed, network });
  const catalog = await insertCatalog(db);
  const shops = await loadShops(db, network.profiles, network.areas);
  const firstId = await nextIds(db);
  const nowMs = options.now.getTime();
  const claims = claimMaker(seededRandom(seed ^ CLAIM_STREAM), await claimContext(db, catalog, nowMs));
  const makePlans = planMaker(seededRandom(seed ^ PLAN_STREAM), firstId.plan);
  await db.destroy();

  const sqlite = new SQLite(options.file);
  // No journal while loading a file that is thrown away if the load fails; WAL is left on from DELETE mode only.
  sqlite.pragma('journal_mode = delete');
  sqlite.pragma('journal_mode = off');
  sqlite.pragma('synchronous = off');
  sqlite.pragma('cache_size = -262144');
  sqlite.pragma('foreign_keys = off');
  const restoreIndexes = dropSecondaryIndexes(sqlite);
  const tables = [...new Set([...TABLES, ...CLAIM_TABLES, ...PLAN_TABLES])];
  const insert = Object.fromEntries(tables.map((table) => [table, bulkInserter(sqlite, table)])) as Record<(typeof tables)[number], (rows: readonly object[]) => void>;
  // A failed unit's line was written with its build, before its claim came due.
  const markRemoved = sqlite.prepare('update build_items set removed_on = ? where id = ?');
  const counts: NetworkCounts = { locations: shops.length, customers: 0, vehicles: 0, builds: 0, buildItems: 0, buildEvents: 0, auditLog: 0, warrantyClaims: 0, claimEvents: 0, powerPlans: 0 };
  const writeWeek = sqlite.transaction((rows: HistoryRows, claimRows: ClaimRows, plans?: PlanRows) => {
    for (const table of TABLES) {
      insert[table](rows[table]);
      counts[table] += rows[table].length;
    }
    for (const table of PLAN_TABLES) insert[table](plans?.[table] ?? []);
    counts.powerPlans += plans?.powerPlans.length ?? 0;
    for (const table of CLAIM_TABLES) {
      insert[table](claimRows[table]);
      counts[table] += claimRows[table].length;
    }
    for (const { id, removedOn } of claimRows.removed) markRemoved.run(removedOn, id);
  });

  const random = seededRandom(seed ^ 0x5eed_b00c);
  const makeRows = historyRowMaker(random, catalog, firstId, nowMs, { audit: true });
  const days = shops.map((shop) => shopDays(random, shop, nowMs, historyDays, [] as SimCustomer[]));
  const totalDays = historyDays + 1;
  let latestBuildMs = -Infinity;
  for (let day = 0, open = days.length; open > 0; ) {
    const week: SimBuild[] = [];
    for (let n = 0; n < DAYS_PER_BATCH && open > 0; n++, day++) {
      open = 0;
      for (const shop of days) {
        const next = shop.next();
        if (!next.done) {
          open++;
          week.push(...next.value);
        }
      }
    }
    const rows = makeRows(week);
    const plans = makePlans(rows);
    claims.add(rows, plans.tightBuilds);
    latestBuildMs = rows.builds.reduce((latest, b) => Math.max(latest, Date.parse(b.createdAt)), latestBuildMs);
    writeWeek(rows, claims.flush(latestBuildMs - SETTLED_MS), plans);
    options.onProgress?.({ days: Math.min(day, totalDays), totalDays, builds: counts.builds, indexing: false });
  }
  const empty: HistoryRows = { customers: [], vehicles: [], builds: [], buildItems: [], buildEvents: [], auditLog: [] };
  writeWeek(empty, claims.flush(Infinity));
  options.onProgress?.({ days: totalDays, totalDays, builds: counts.builds, indexing: true });
  restoreIndexes();
  sqlite.pragma('foreign_keys = on');
  sqlite.pragma('journal_mode = wal');
  sqlite.close();
  return counts;
}
