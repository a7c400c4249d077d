import type SQLite from 'better-sqlite3';
import { REFILL_UNIT_EXPOSURE } from '../migrations/046-create-workmanship-counts.ts';
import { REFILL_ROLLUPS } from '../migrations/042-create-rollup-sums.ts';
import { REFILL_MONTH_CLOSE_SUMS } from '../migrations/056-create-month-close-sums.ts';
import { REFILL_BUILD_COUNTS } from '../migrations/061-create-build-counts.ts';

/**
 * Bulk loading into SQLite: secondary indexes and triggers are dropped before and re-created from
 * their own saved SQL after, so whatever the migrations define (today's and later ones) comes back
 * as it was, built once instead of row by row.
 */
export function dropSecondaryIndexes(sqlite: SQLite.Database): () => void {
  const fullText = fullTextTables(sqlite);
  const saved = sqlite
    .prepare(`select type, name, sql from sqlite_master where type in ('index', 'trigger') and sql is not null order by type, name`)
    .all() as { type: 'index' | 'trigger'; name: string; sql: string }[];
  for (const { type, name } of saved) sqlite.exec(`drop ${type} "${name}"`);
  return () => {
    // Indexes first, so a trigger's statements find them; then refill full-text, reliability, roll-up, month close and build count tables and gather statistics.
    for (const { sql } of saved.filter((s) => s.type === 'index')) sqlite.exec(sql);
    for (const { sql } of saved.filter((s) => s.type === 'trigger')) sqlite.exec(sql);
    for (const name of fullText) sqlite.exec(`insert into "${name}"("${name}") values ('rebuild')`);
    sqlite.exec(REFILL_UNIT_EXPOSURE);
    sqlite.exec(REFILL_ROLLUPS);
    sqlite.exec(REFILL_MONTH_CLOSE_SUMS);
    sqlite.exec(REFILL_BUILD_COUNTS);
    sqlite.pragma('analysis_limit = 1000');
    sqlite.exec('analyze');
    sqlite.pragma('optimize');
  };
}

/** FTS5 tables, to rebuild from the table whose content they index; one that keeps its own content has no source to rebuild from. */
function fullTextTables(sqlite: SQLite.Database): string[] {
  const tables = sqlite
    .prepare(`select name, sql from sqlite_master where type = 'table' and sql like 'create virtual table%using fts5%'`)
    .all() as { name: string; sql: string }[];
  for (const { name, sql } of tables) {
    if (!/content\s*=\s*'?"?[a-z_]/i.test(sql)) throw new Error(`full-text table ${name} keeps its own content: a bulk load cannot rebuild it`);
  }
  return tables.map((t) => t.name);
}

const snake = (name: string) => name.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);

/** Inserts rows of camelCase objects into `table` through one prepared statement, made from the first row's fields. */
export function bulkInserter(sqlite: SQLite.Database, table: string): (rows: readonly object[]) => void {
  let insert: ((row: object) => void) | null = null;
  return (rows) => {
    if (rows.length === 0) return;
    if (!insert) {
      const fields = Object.keys(rows[0]!);
      const statement = sqlite.prepare(`insert into ${snake(table)} (${fields.map(snake).join(', ')}) values (${fields.map(() => '?').join(', ')})`);
      insert = (row) => statement.run(fields.map((f) => (row as Record<string, unknown>)[f]));
    }
    for (const row of rows) insert(row);
  };
}
