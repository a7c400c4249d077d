import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import SQLite from 'better-sqlite3';
import { CamelCasePlugin, CompiledQuery, Kysely, Migrator, SqliteDialect, SqliteDriver, type DatabaseConnection, type Driver, type SqliteDatabase, type SqliteDialectConfig } from 'kysely';
import { migrations } from './migrations/index.ts';
import type { Database } from './schema/index.ts';

export type Db = Kysely<Database>;

/**
 * Opens (creating if needed) the SQLite file with WAL, foreign keys and a busy timeout. A
 * connection for reading only (`queryOnly`) refuses every write.
 */
export function openDatabase(file: string, { queryOnly = false } = {}): Db {
  if (file !== ':memory:') mkdirSync(dirname(file), { recursive: true });
  const sqlite = new SQLite(file);
  sqlite.pragma('journal_mode = WAL');
  sqlite.pragma('foreign_keys = ON');
  sqlite.pragma('busy_timeout = 5000');
  if (queryOnly) sqlite.pragma('query_only = ON');
  return new Kysely<Database>({ dialect: new ImmediateSqliteDialect({ database: reusingStatements(sqlite) }), plugins: [new CamelCasePlugin()] });
}

/**
 * Transactions take the write lock as they begin (BEGIN IMMEDIATE), waiting their turn. One begun
 * plainly reads first and fails with SQLITE_BUSY when it comes to write if another connection (an
 * import's worker thread) has written since: a claim number or an import lost to a chance overlap.
 */
class ImmediateSqliteDialect extends SqliteDialect {
  constructor(private readonly settings: SqliteDialectConfig) {
    super(settings);
  }

  override createDriver(): Driver {
    return new (class extends SqliteDriver {
      override async beginTransaction(connection: DatabaseConnection): Promise<void> {
        await connection.executeQuery(CompiledQuery.raw('begin immediate'));
      }
    })(this.settings);
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
