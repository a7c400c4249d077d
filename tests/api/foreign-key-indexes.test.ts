import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { migrateToLatest, openDatabase } from '@busbar/db';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

/**
 * Deleting a row makes SQLite look for the rows whose foreign keys name it. Without an index led by
 * the referring column that look reads the whole referring table, once for every row deleted:
 * before migration 044, each build line deleted read every warranty claim (20 ms a line on 200
 * shops). The tables the app deletes from are read off its source, with those their rows cascade to.
 */
const db = openDatabase(':memory:');
beforeAll(() => migrateToLatest(db));
afterAll(() => db.destroy());

const snake = (name: string) => name.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);

function deletedInSource(dir: string): string[] {
  return readdirSync(dir, { recursive: true, encoding: 'utf8' })
    .filter((file) => file.endsWith('.ts'))
    .flatMap((file) => [...readFileSync(join(dir, file), 'utf8').matchAll(/deleteFrom\('(\w+)'/g)].map((m) => snake(m[1]!)));
}

interface ForeignKey {
  child: string;
  column: string;
  parent: string;
  onDelete: string;
}

describe('foreign keys of deleted rows', () => {
  it('every column that refers to a table the app deletes from leads an index of its table', async () => {
    const { rows: keys } = await sql<ForeignKey>`select m.name as child, f."from" as "column", f."table" as parent, f.on_delete as on_delete
      from sqlite_master m join pragma_foreign_key_list(m.name) f where m.type = 'table'`.execute(db);
    const deleted = new Set(deletedInSource(join(import.meta.dirname, '../../apps/api/src')));
    expect(deleted).toContain('build_items');
    // A cascade deletes the referring rows too.
    for (let grew = true; grew; ) {
      grew = false;
      for (const key of keys.filter((k) => k.onDelete === 'CASCADE' && deleted.has(k.parent) && !deleted.has(k.child))) {
        deleted.add(key.child);
        grew = true;
      }
    }
    const unindexed: string[] = [];
    for (const key of keys.filter((k) => deleted.has(k.parent))) {
      const { rows: indexes } = await sql<{ name: string }>`select name from pragma_index_list(${key.child})`.execute(db);
      const leading = await Promise.all(indexes.map(async ({ name }) => (await sql<{ name: string }>`select name from pragma_index_info(${name}) where seqno = 0`.execute(db)).rows[0]?.name));
      const { rows: primary } = await sql<{ name: string; type: string; pk: number }>`select name, type, pk from pragma_table_info(${key.child}) where pk = 1`.execute(db);
      // An integer primary key is the rowid: its own index.
      const rowid = primary.some((c) => c.name === key.column && c.type.toLowerCase() === 'integer');
      if (!leading.includes(key.column) && !rowid) unindexed.push(`${key.child}.${key.column} → ${key.parent}`);
    }
    expect(unindexed).toEqual([]);
  });
});
