import type { Db } from '@busbar/db';
import type { SerialMatch } from '@busbar/shared';
import { startsWith } from './search.ts';

/** Installed units whose serial number starts with `prefix` (any case), at the given locations. */
export async function findSerials(db: Db, locationIds: number[], prefix: string): Promise<SerialMatch[]> {
  if (locationIds.length === 0) return [];
  return db
    .selectFrom('buildItems as i')
    .innerJoin('builds as b', 'b.id', 'i.buildId')
    .innerJoin('locations as l', 'l.id', 'b.locationId')
    .innerJoin('catalogItems as c', 'c.id', 'i.catalogItemId')
    .select(['i.serialNumber', 'i.sku', 'c.name', 'b.id as buildId', 'b.number as buildNumber', 'l.code as locationCode', 'b.status', 'b.deliveredAt'])
    .where('b.locationId', 'in', locationIds)
    .where(startsWith('i.serialNumber', prefix))
    .orderBy('i.serialNumber')
    .limit(50)
    .execute() as Promise<SerialMatch[]>;
}
