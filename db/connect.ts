import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import SQLite from 'better-sqlite3';
import { CamelCasePlugin, Kysely, Migrator, SqliteDialect, SqliteDriver, type Driver, type SqliteDatabase, type SqliteDialectConfig } from 'kysely';
import { migrations } from './migrations/index.ts';
import type { Database } from './schema/index.ts';

export type Db = Kysely<Database>;

/**
 * Opens (creating if needed) the SQLite file with WAL, foreign keys and a busy timeout: how long a
 * write waits for another connection's to end before it fails with SQLITE_BUSY. A connection for
 * reading only (`queryOnly`) refuses every write.
 */
export function openDatabase(file: string, { queryOnly = false, busyTimeoutMs = 5000 } = {}): Db {
  if (file !== ':memory:') mkdirSync(dirname(file), { recursive: true });
  const sqlite = new SQLite(file);
  sqlite.pragma('journal_mode = WAL');
  sqlite.pragma('foreign_keys = ON');
  sqlite.pragma(`busy_timeout = ${busyTimeoutMs}`);
  if (queryOnly) sqlite.pragma('query_only = ON');
  const dialect = new ImmediateSqliteDialect({ database: reusingStatements(sqlite) }, sqlite, busyTimeoutMs);
  return new Kysely<Database>({ dialect, plugins: [new CamelCasePlugin()] });
}

/** The longest pause between a waiting transaction's tries for the write lock, in ms. */
const LONGEST_PAUSE_MS = 10;

/**
 * Transactions take the write lock as they begin (BEGIN IMMEDIATE). One begun plainly reads first
 * and fails with SQLITE_BUSY when it comes to write if another connection (an import's worker
 * thread, the other app process) has written since: a claim number or an import lost to a chance
 * overlap. While another connection holds the lock, the transaction tries again after pauses
 * (1, 2, 4 … 10 ms) and lends the connection to the process's other queries meanwhile: SQLite's
 * busy handler would sleep on the thread, holding up every request of the process for as long as
 * the lock stays taken (an import's batch and its commit). Past the busy timeout it fails with
 * SQLITE_BUSY. A write outside a transaction still waits in the busy handler.
 */
class ImmediateSqliteDialect extends SqliteDialect {
  constructor(
    private readonly settings: SqliteDialectConfig,
    private readonly sqlite: SQLite.Database,
    private readonly busyTimeoutMs: number,
  ) {
    super(settings);
  }

  override createDriver(): Driver {
    const { sqlite, busyTimeoutMs } = this;
    return new (class extends SqliteDriver {
      override async beginTransaction(): Promise<void> {
        const giveUpAt = performance.now() + busyTimeoutMs;
        for (let pause = 1; !beginsNow(sqlite, busyTimeoutMs); pause = Math.min(2 * pause, LONGEST_PAUSE_MS)) {
          if (performance.now() >= giveUpAt) throw Object.assign(new Error('database is locked'), { code: 'SQLITE_BUSY' });
          await this.releaseConnection();
          await new Promise((resolve) => setTimeout(resolve, pause));
          await this.acquireConnection();
        }
      }
    })(this.settings);
  }
}

/** Begins a transaction holding the write lock, or answers false at once if another connection holds it. */
function beginsNow(sqlite: SQLite.Database, busyTimeoutMs: number): boolean {
  sqlite.pragma('busy_timeout = 0');
  try {
    sqlite.exec('begin immediate');
    return true;
  } catch (error) {
    if (String((error as { code?: unknown }).code).startsWith('SQLITE_BUSY')) return false;
    throw error;
  } finally {
    sqlite.pragma(`busy_timeout = ${busyTimeoutMs}`);
  }
}

/** Prepared statements kept per connection; the most used queries stay, the rest are prepared again. */
const STATEMENTS_KEPT = 500;

/**
 * The connection as Kysely sees it, with `prepare` answering an already prepared statement for SQL
 * it has seen (Kysely prepares again for every query). A statement still busy with an unfinished
 * stream gets a fresh copy instead.
 */
function reusingStatements(sqlite: SQLite.Database): SqliteDatabase {
  const kept = new Map<string, SQLite.Statement>();
  return {
    close: () => sqlite.close(),
    prepare(sql: string) {
      const statement = kept.get(sql);
      if (statement && !statement.busy) {
        // Move it to the back, so the least recently used statement is the first to go.
        kept.delete(sql);
        kept.set(sql, statement);
        return statement;
      }
      const fresh = sqlite.prepare(sql);
      if (!statement) {
        if (kept.size >= STATEMENTS_KEPT) kept.delete(kept.keys().next().value!);
        kept.set(sql, fresh);
      }
      return fresh;
    },
  };
}

/** A migration about to run: its name, how many of the pending ones ran before it, and of how many. */
export interface MigrationStep {
  name: string;
  done: number;
  of: number;
}

/**
 * Applies every pending migration, one at a time, telling `onStep` before each (on a network's
 * database one can take minutes); throws with the failing migration's name.
 */
export async function migrateToLatest(db: Kysely<any>, onStep: (step: MigrationStep) => void = () => {}): Promise<void> {
  const migrator = new Migrator({ db, provider: { getMigrations: async () => migrations } });
  const pending = (await migrator.getMigrations()).filter((m) => !m.executedAt);
  for (const [done, { name }] of pending.entries()) {
    onStep({ name, done, of: pending.length });
    const { error } = await migrator.migrateUp();
    if (error) throw new Error(`Migration ${name} failed: ${String(error)}`);
  }
}
