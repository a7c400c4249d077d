import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import SQLite from 'better-sqlite3';
import { CamelCasePlugin, Kysely, Migrator, SqliteDialect, SqliteDriver, type Driver, type PluginTransformResultArgs, type QueryResult, type SqliteDatabase, type SqliteDialectConfig, type SqliteStatement, type UnknownRow } from 'kysely';
import { migrations } from './migrations/index.ts';
import { shapedRows } from './row-shapes.ts';
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
  const naming = new CamelCaseColumns();
  const dialect = new ImmediateSqliteDialect({ database: reusingStatements(sqlite, (column) => naming.columnName(column)) }, sqlite, busyTimeoutMs);
  return new Kysely<Database>({ dialect, plugins: [naming] });
}

/**
 * Kysely's camel case: queries' names turned to snake case, and rows read with their columns'
 * names in camel case already (see row-shapes.ts), so results are left as they come.
 */
class CamelCaseColumns extends CamelCasePlugin {
  columnName(column: string): string {
    return this.camelCase(column);
  }

  override async transformResult(args: PluginTransformResultArgs): Promise<QueryResult<UnknownRow>> {
    return args.result;
  }
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
/** Statements that change tables (migrations, tests); the app changes its schema through Kysely only. */
const SCHEMA_CHANGE = /^\s*(create|alter|drop)\s/i;

/**
 * The connection as Kysely sees it, with `prepare` answering an already prepared statement for SQL
 * it has seen (Kysely prepares again for every query). A statement still busy with an unfinished
 * stream gets a fresh copy instead. Rows come keyed by `nameOf` their columns' names.
 */
function reusingStatements(sqlite: SQLite.Database, nameOf: (column: string) => string): SqliteDatabase {
  const kept = new Map<string, { statement: SQLite.Statement; shaped: SqliteStatement }>();
  return {
    close: () => sqlite.close(),
    prepare(sql: string) {
      // A change of the schema can change the columns of a kept `select *`: everything is prepared again.
      if (SCHEMA_CHANGE.test(sql)) kept.clear();
      const known = kept.get(sql);
      if (known && !known.statement.busy) {
        // Move it to the back, so the least recently used statement is the first to go.
        kept.delete(sql);
        kept.set(sql, known);
        return known.shaped;
      }
      const statement = sqlite.prepare(sql);
      const shaped = shapedRows(statement, nameOf);
      if (!known) {
        if (kept.size >= STATEMENTS_KEPT) kept.delete(kept.keys().next().value!);
        kept.set(sql, { statement, shaped });
      }
      return shaped;
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
