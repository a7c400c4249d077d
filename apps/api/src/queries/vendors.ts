import type { Db } from '@busbar/db';
import type { Page, VendorBody, VendorView } from '@busbar/shared';
import { cappedCount, offsetOf } from './paging.ts';

const VENDOR_COLUMNS = ['id', 'name', 'rmaEmail', 'defaultWarrantyMonths', 'notes', 'active', 'version'] as const;

type VendorRow = Omit<VendorView, 'active'> & { active: number };

const toView = ({ active, ...row }: VendorRow): VendorView => ({ ...row, active: active === 1 });
const toColumns = ({ active, ...body }: VendorBody) => ({ ...body, active: active ? 1 : 0 });

export async function listVendors(db: Db, paging: { page: number; pageSize: number }): Promise<Page<VendorView>> {
  const { page, pageSize } = paging;
  const [rows, count] = await Promise.all([
    db.selectFrom('vendors').select(VENDOR_COLUMNS).orderBy('name').orderBy('id').limit(pageSize).offset(offsetOf(page, pageSize)).execute(),
    cappedCount(db, db.selectFrom('vendors').select('id')),
  ]);
  return { items: rows.map(toView), ...count, page, pageSize };
}

export async function findVendor(db: Db, id: number): Promise<VendorView | undefined> {
  const row = await db.selectFrom('vendors').select(VENDOR_COLUMNS).where('id', '=', id).executeTakeFirst();
  return row && toView(row);
}

/** Whether another vendor already goes by this name; names differing only in case count as one. */
export async function vendorNameTaken(db: Db, name: string, exceptId?: number): Promise<boolean> {
  let query = db
    .selectFrom('vendors')
    .select('id')
    .where((eb) => eb(eb.fn('lower', ['name']), '=', eb.fn('lower', [eb.val(name)])));
  if (exceptId !== undefined) query = query.where('id', '!=', exceptId);
  return !!(await query.executeTakeFirst());
}

export async function insertVendor(db: Db, body: VendorBody): Promise<number> {
  const row = await db.insertInto('vendors').values(toColumns(body)).returning('id').executeTakeFirstOrThrow();
  return row.id;
}

/** Writes an edit made against `version`; false when the vendor has changed since. */
export async function updateVendor(db: Db, id: number, version: number, body: VendorBody): Promise<boolean> {
  const result = await db
    .updateTable('vendors')
    .set((eb) => ({ ...toColumns(body), version: eb('version', '+', 1) }))
    .where('id', '=', id)
    .where('version', '=', version)
    .executeTakeFirst();
  return result.numUpdatedRows > 0n;
}
