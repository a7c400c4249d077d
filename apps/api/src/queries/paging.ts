import type { Db } from '@busbar/db';
import { COUNT_CAP } from '@busbar/shared';
import { sql, type Expression, type SelectQueryBuilder, type SqlBool } from 'kysely';
import { invalidField } from '../errors.ts';

/** Rows to skip for a page number; deep pages are refused, they are read by cursor instead. */
export function offsetOf(page: number, pageSize: number): number {
  const offset = (page - 1) * pageSize;
  if (offset >= COUNT_CAP) {
    throw invalidField('page', `Pages reach row ${COUNT_CAP.toLocaleString('en-US')}: narrow the list, or read on with its nextCursor`);
  }
  return offset;
}

/** How many rows a list holds, counted no further than a cap: past it, `totalCapped` says there are more. */
export interface Count {
  total: number;
  totalCapped: boolean;
}

/**
 * How many rows a query finds, counting no further than COUNT_CAP: counting every row of a
 * network-wide list would read the whole table on every request.
 */
export async function cappedCount(db: Db, rows: SelectQueryBuilder<any, any, any>, cap = COUNT_CAP): Promise<Count> {
  const { n } = await db
    .selectFrom(rows.clearOrderBy().limit(cap + 1).as('matching'))
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .executeTakeFirstOrThrow();
  return { total: Math.min(Number(n), cap), totalCapped: Number(n) > cap };
}

/** Where a page read by cursor ended: the last row's sort value and id. */
export interface Keyset {
  value: string | number | null;
  id: number;
}

export const encodeCursor = (key: Keyset) => Buffer.from(JSON.stringify([key.value, key.id])).toString('base64url');

export function decodeCursor(cursor: string): Keyset {
  try {
    const [value, id] = JSON.parse(Buffer.from(cursor, 'base64url').toString()) as unknown[];
    const valueOk = value === null || typeof value === 'string' || typeof value === 'number';
    if (valueOk && Number.isInteger(id)) return { value: value as Keyset['value'], id: id as number };
  } catch {
    // answered below like any other unreadable cursor
  }
  throw invalidField('cursor', 'This cursor is not one a list gave out');
}

/**
 * Rows after `key` in the order `column order, id order` (SQLite puts nulls first ascending,
 * last descending; only a `nullable` column has any). Written as a range on `column` so the sort index seeks to the cursor
 * instead of reading past every earlier row.
 */
export function afterKey(column: string, idColumn: string, order: 'asc' | 'desc', key: Keyset, nullable = false): Expression<SqlBool> {
  const col = sql.ref(column);
  const id = sql.ref(idColumn);
  if (key.value === null) {
    return order === 'desc'
      ? sql<SqlBool>`(${col} is null and ${id} < ${key.id})`
      : sql<SqlBool>`((${col} is null and ${id} > ${key.id}) or ${col} is not null)`;
  }
  if (order === 'desc') {
    const before = sql<SqlBool>`(${col} <= ${key.value} and (${col} < ${key.value} or ${id} < ${key.id}))`;
    return nullable ? sql<SqlBool>`(${before} or ${col} is null)` : before;
  }
  return sql<SqlBool>`(${col} >= ${key.value} and (${col} > ${key.value} or ${id} > ${key.id}))`;
}
