import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import SQLite from 'better-sqlite3';
import { CamelCasePlugin, Kysely, Migrator, SqliteDialect } from 'kysely';
import { migrations } from './migrations/index.ts';
import type { Database } from './schema/index.ts';

export type Db = Kysely<Database>;

/** Opens (creating if needed) the SQLite file with WAL, foreign keys and a busy timeout. */
export function openDatabase(file: string): Db {
  if (file !== ':memory:') mkdirSync(dirname(file), { recursive: true });
  const sqlite = new SQLite(file);
  sqlite.pragma('journal_mode = WAL');
  sqlite.pragma('foreign_keys = ON');
  sqlite.pragma('busy_timeout = 5000');
  return new Kysely<Database>({ dialect: new SqliteDialect({ database: sqlite }), plugins: [new CamelCasePlugin()] });
}

/** Applies every pending migration; throws with the failing migration's name. */
export async function migrateToLatest(db: Kysely<any>): Promise<void> {
  const migrator = new Migrator({ db, provider: { getMigrations: async () => migrations } });
  const { error, results } = await migrator.migrateToLatest();
  if (error) {
    const failed = results?.find((r) => r.status === 'Error')?.migrationName ?? 'unknown';
    throw new Error(`Migration ${failed} failed: ${String(error)}`);
  }
}
