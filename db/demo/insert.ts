import type { Insertable } from 'kysely';
import type { Db } from '../connect.ts';
import type { Database } from '../schema/index.ts';

/** Rows per statement: well under SQLite's limit of bound values even for the widest table. */
const CHUNK_ROWS = 300;

/** Inserts many rows with one multi-row statement per chunk. */
export async function insertInChunks<T extends keyof Database & string>(db: Db, table: T, rows: Insertable<Database[T]>[]): Promise<void> {
  for (let start = 0; start < rows.length; start += CHUNK_ROWS) {
    await db.insertInto(table).values(rows.slice(start, start + CHUNK_ROWS)).execute();
  }
}

/** The largest id in a table so far, so generated rows can carry their ids from the start. */
async function lastId(db: Db, table: 'customers' | 'vehicles' | 'builds' | 'powerPlans'): Promise<number> {
  const row = await db.selectFrom(table).select((eb) => eb.fn.max('id').as('id')).executeTakeFirst();
  return Number(row?.id ?? 0);
}

/** The first free id of each table the history fills. */
export async function nextIds(db: Db): Promise<{ customer: number; vehicle: number; build: number; plan: number }> {
  return {
    customer: (await lastId(db, 'customers')) + 1,
    vehicle: (await lastId(db, 'vehicles')) + 1,
    build: (await lastId(db, 'builds')) + 1,
    plan: (await lastId(db, 'powerPlans')) + 1,
  };
}
