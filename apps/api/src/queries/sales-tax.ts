import type { Db } from '@busbar/db';
import type { SalesTaxBody, SalesTaxView } from '@busbar/shared';

/** A location's sales tax rates, the latest month first, with who set them. */
export async function listSalesTax(db: Db, locationId: number): Promise<SalesTaxView[]> {
  const rows = await db
    .selectFrom('salesTaxRates as t')
    .leftJoin('users as u', 'u.id', 't.createdBy')
    .select(['t.id', 't.appliesFrom', 't.basisPoints', 't.laborTaxed', 't.createdAt', 'u.name as createdByName'])
    .where('t.locationId', '=', locationId)
    .orderBy('t.appliesFrom', 'desc')
    .execute();
  return rows.map((r) => ({ ...r, laborTaxed: r.laborTaxed === 1 }));
}

/**
 * Sets a rate from a month on; answers false, writing nothing, when that month already has one.
 * The conflict clause keeps two owners saving the same month at once to one row.
 */
export async function addSalesTax(db: Db, locationId: number, rate: SalesTaxBody, by: { id: number; at: string }): Promise<boolean> {
  const inserted = await db
    .insertInto('salesTaxRates')
    .values({ locationId, appliesFrom: rate.appliesFrom, basisPoints: rate.basisPoints, laborTaxed: rate.laborTaxed ? 1 : 0, createdBy: by.id, createdAt: by.at })
    .onConflict((oc) => oc.columns(['locationId', 'appliesFrom']).doNothing())
    .returning('id')
    .executeTakeFirst();
  return inserted !== undefined;
}
