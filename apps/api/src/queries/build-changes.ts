import { buildTotals } from '@busbar/calc';
import type { Db } from '@busbar/db';
import type { BuildStatus } from '@busbar/shared';
import type { Updateable } from 'kysely';
import type { Database } from '@busbar/db';
import { stale } from '../errors.ts';

/**
 * Applies a change to a build only if nobody changed it since `version` was read, and moves it
 * to the next version; a stale edit throws 409.
 */
export async function changeBuild(
  db: Db,
  id: number,
  version: number,
  at: string,
  patch: Updateable<Database['builds']> = {},
): Promise<void> {
  const result = await db
    .updateTable('builds')
    .set((eb) => ({ ...patch, updatedAt: at, version: eb('version', '+', 1) }))
    .where('id', '=', id)
    .where('version', '=', version)
    .executeTakeFirst();
  if (result.numUpdatedRows !== 1n) throw stale();
}

/** Stores the totals of a build from its items and labor (see `buildTotals`). */
export async function recomputeTotals(db: Db, id: number): Promise<void> {
  const build = await db.selectFrom('builds').select(['laborHours', 'laborRateCents']).where('id', '=', id).executeTakeFirstOrThrow();
  const lines = await db.selectFrom('buildItems').select(['quantity', 'unitPriceCents', 'unitCostCents']).where('buildId', '=', id).execute();
  const totals = buildTotals(lines, build.laborHours, build.laborRateCents);
  await db
    .updateTable('builds')
    .set({
      laborCents: totals.laborCents,
      partsPriceCents: totals.partsPriceCents,
      partsCostCents: totals.partsCostCents,
      totalCents: totals.totalCents,
    })
    .where('id', '=', id)
    .execute();
}

export async function addBuildEvent(
  db: Db,
  event: { buildId: number; at: string; actorId: number; kind: 'status' | 'correction'; fromStatus?: BuildStatus | null; toStatus?: BuildStatus | null; note: string },
): Promise<void> {
  await db
    .insertInto('buildEvents')
    .values({ fromStatus: null, toStatus: null, ...event })
    .execute();
}

/** The build that already holds this serial number of this SKU, if any. */
export function serialHolder(db: Db, sku: string, serialNumber: string, exceptItemId = 0) {
  return db
    .selectFrom('buildItems as i')
    .innerJoin('builds as b', 'b.id', 'i.buildId')
    .select(['b.id', 'b.number', 'b.locationId'])
    .where('i.sku', '=', sku)
    .where('i.serialNumber', '=', serialNumber)
    .where('i.id', '!=', exceptItemId)
    .executeTakeFirst();
}
