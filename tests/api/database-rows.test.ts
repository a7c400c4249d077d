import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { openDatabase } from '@busbar/db';
import SQLite from 'better-sqlite3';
import { CamelCasePlugin, Kysely, sql, SqliteDialect } from 'kysely';
import { afterEach, describe, expect, it } from 'vitest';
import { shapedRows } from '../../db/row-shapes.ts';

const dirs: string[] = [];
const connections: Kysely<any>[] = [];
afterEach(async () => {
  for (const db of connections.splice(0)) await db.destroy();
  for (const dir of dirs.splice(0)) rmSync(dir, { recursive: true, force: true });
});

/** The app's connection and, on the same file, Kysely's own SQLite dialect and camel case over better-sqlite3's row objects. */
async function twoConnections() {
  const dir = mkdtempSync(join(tmpdir(), 'busbar-rows-'));
  dirs.push(dir);
  const file = join(dir, 'rows.sqlite');
  const db = openDatabase(file) as unknown as Kysely<any>;
  const plain = new Kysely<any>({ dialect: new SqliteDialect({ database: new SQLite(file) }), plugins: [new CamelCasePlugin()] });
  connections.push(db, plain);
  await db.schema
    .createTable('stockCounts')
    .addColumn('id', 'integer', (c) => c.primaryKey())
    .addColumn('shelfCode', 'text', (c) => c.notNull())
    .addColumn('onHandCount', 'integer')
    .addColumn('weightKg', 'real')
    .addColumn('labelImage', 'blob')
    .execute();
  await db
    .insertInto('stockCounts')
    .values([
      { id: 1, shelfCode: 'A-1 Ω', onHandCount: 12, weightKg: 2.5, labelImage: Buffer.from([0, 255, 7]) },
      { id: 2, shelfCode: 'B-2', onHandCount: null, weightKg: null, labelImage: null },
      { id: 3, shelfCode: '', onHandCount: Number.MAX_SAFE_INTEGER, weightKg: -0.125, labelImage: Buffer.alloc(0) },
    ])
    .execute();
  return { db, plain };
}

describe('rows read from the database', () => {
  it('come as better-sqlite3 and Kysely’s camel case give them, for every kind of value, join, alias and repeated name', async () => {
    const { db, plain } = await twoConnections();
    const queries = [
      (k: Kysely<any>) => k.selectFrom('stockCounts').selectAll().orderBy('id').execute(),
      (k: Kysely<any>) => k.selectFrom('stockCounts as s').select(['s.shelfCode as shelf', 's.weightKg', sql<number>`s.on_hand_count * 2`.as('double_count')]).execute(),
      (k: Kysely<any>) => k.selectFrom('stockCounts as a').innerJoin('stockCounts as b', 'b.id', 'a.id').select(['a.id', 'b.id', 'b.shelfCode']).execute(),
      (k: Kysely<any>) => sql`select 1 as a, 2 as a, 'x' as one_two_three, null as "__typename"`.execute(k).then((r) => r.rows),
      (k: Kysely<any>) => k.selectFrom('stockCounts').select((eb) => eb.fn.countAll().as('row_count')).where('id', '>', 5).execute(),
      (k: Kysely<any>) => k.selectFrom('stockCounts').selectAll().where('id', '=', 99).execute(),
    ];
    for (const query of queries) {
      const expected = await query(plain);
      // Twice: the second time from the kept statement.
      expect(await query(db)).toEqual(expected);
      expect(await query(db)).toEqual(expected);
    }
    const first = await db.selectFrom('stockCounts').selectAll().orderBy('id').executeTakeFirstOrThrow();
    expect(Object.keys(first)).toEqual(['id', 'shelfCode', 'onHandCount', 'weightKg', 'labelImage']);
  });

  it('keep their prototype when a column is named __proto__', () => {
    const sqlite = new SQLite(':memory:');
    const [row] = shapedRows(sqlite.prepare(`select null as "__proto__", 5 as n`), (column) => column).all([]) as Record<string, unknown>[];
    expect(Object.getPrototypeOf(row)).toBe(Object.prototype);
    expect(Object.entries(row!)).toEqual([['__proto__', null], ['n', 5]]);
    sqlite.close();
  });

  it('come the same when streamed and from inserts that return them', async () => {
    const { db, plain } = await twoConnections();
    const all = () => db.selectFrom('stockCounts').selectAll().orderBy('id');
    const expected = await plain.selectFrom('stockCounts').selectAll().orderBy('id').execute();
    const streamed = [];
    for await (const row of all().stream()) streamed.push(row);
    expect(streamed).toEqual(expected);
    expect(await all().execute()).toEqual(expected);
    const inserted = await db.insertInto('stockCounts').values({ id: 4, shelfCode: 'C-3', onHandCount: 1 }).returningAll().executeTakeFirst();
    expect(inserted).toEqual(await plain.selectFrom('stockCounts').selectAll().where('id', '=', 4).executeTakeFirst());
  });

  it('follow the table when a column is added or renamed after the same query ran', async () => {
    const { db } = await twoConnections();
    const first = () => db.selectFrom('stockCounts').selectAll().where('id', '=', 1).executeTakeFirstOrThrow();
    expect(Object.keys(await first())).not.toContain('binNote');
    await db.schema.alterTable('stockCounts').addColumn('binNote', 'text', (c) => c.defaultTo('top shelf')).execute();
    expect(await first()).toMatchObject({ shelfCode: 'A-1 Ω', binNote: 'top shelf' });
    await db.schema.alterTable('stockCounts').renameColumn('binNote', 'shelfNote').execute();
    const renamed = await first();
    expect(renamed).toMatchObject({ shelfNote: 'top shelf' });
    expect(renamed).not.toHaveProperty('binNote');
  });
});
