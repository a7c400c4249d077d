import type { Db } from '@busbar/db';
import { CATEGORIES, type catalogQuery, type CatalogItemBody, type CatalogItemView, type Page } from '@busbar/shared';
import { sql } from 'kysely';
import type { z } from 'zod';
import { cappedCount, offsetOf } from './paging.ts';
import { contains } from './search.ts';

type CatalogFilter = z.output<typeof catalogQuery>;

const ITEM_COLUMNS = [
  'c.id', 'c.sku', 'c.vendorId', 'v.name as vendorName', 'c.category', 'c.name', 'c.specs', 'c.serialized',
  'c.unitCostCents', 'c.unitPriceCents', 'c.warrantyMonths', 'c.active', 'c.version',
] as const;

/** A row as stored: JSON specs, 0/1 flags, and both money fields, which every row has. */
type ItemRow = Omit<CatalogItemView, 'specs' | 'serialized' | 'active' | 'marginCents' | 'unitCostCents' | 'unitPriceCents'> & {
  specs: string;
  serialized: number;
  active: number;
  unitCostCents: number;
  unitPriceCents: number;
};

function toView(row: ItemRow): CatalogItemView {
  return {
    ...row,
    specs: JSON.parse(row.specs) as Record<string, unknown>,
    serialized: row.serialized === 1,
    active: row.active === 1,
    marginCents: row.unitPriceCents - row.unitCostCents,
  };
}

const toColumns = ({ specs, serialized, active, ...body }: CatalogItemBody) => ({
  ...body,
  specs: JSON.stringify(specs),
  serialized: serialized ? 1 : 0,
  active: active ? 1 : 0,
});

/** Categories in the order of the shared list, house batteries first. */
const categoryOrder = sql<number>`case ${sql.ref('c.category')} ${sql.join(
  CATEGORIES.map((category, i) => sql`when ${category} then ${i}`),
  sql` `,
)} end`;

const items = (db: Db) => db.selectFrom('catalogItems as c').innerJoin('vendors as v', 'v.id', 'c.vendorId');

export async function listCatalog(db: Db, filter: CatalogFilter): Promise<Page<CatalogItemView>> {
  let query = items(db);
  if (filter.category) query = query.where('c.category', '=', filter.category);
  if (filter.vendorId) query = query.where('c.vendorId', '=', filter.vendorId);
  if (filter.active !== 'all') query = query.where('c.active', '=', filter.active === 'true' ? 1 : 0);
  const q = filter.q;
  if (q) query = query.where((eb) => eb.or([contains('c.sku', q), contains('c.name', q)]));
  const [rows, count] = await Promise.all([
    query
      .select(ITEM_COLUMNS)
      .orderBy(categoryOrder)
      .orderBy('c.name')
      .orderBy('c.id')
      .limit(filter.pageSize)
      .offset(offsetOf(filter.page, filter.pageSize))
      .execute(),
    cappedCount(db, query.select('c.id')),
  ]);
  return { items: rows.map(toView), ...count, page: filter.page, pageSize: filter.pageSize };
}

export async function findCatalogItem(db: Db, id: number): Promise<CatalogItemView | undefined> {
  const row = await items(db).select(ITEM_COLUMNS).where('c.id', '=', id).executeTakeFirst();
  return row && toView(row);
}

/** Whether another item already has this SKU; SKUs differing only in case count as one. */
export async function skuTaken(db: Db, sku: string, exceptId?: number): Promise<boolean> {
  let query = db
    .selectFrom('catalogItems')
    .select('id')
    .where((eb) => eb(eb.fn('lower', ['sku']), '=', eb.fn('lower', [eb.val(sku)])));
  if (exceptId !== undefined) query = query.where('id', '!=', exceptId);
  return !!(await query.executeTakeFirst());
}

export async function insertCatalogItem(db: Db, body: CatalogItemBody): Promise<number> {
  const row = await db.insertInto('catalogItems').values(toColumns(body)).returning('id').executeTakeFirstOrThrow();
  return row.id;
}

/** Writes an edit made against `version`; false when the item has changed since. */
export async function updateCatalogItem(db: Db, id: number, version: number, body: CatalogItemBody): Promise<boolean> {
  const result = await db
    .updateTable('catalogItems')
    .set((eb) => ({ ...toColumns(body), version: eb('version', '+', 1) }))
    .where('id', '=', id)
    .where('version', '=', version)
    .executeTakeFirst();
  return result.numUpdatedRows > 0n;
}
