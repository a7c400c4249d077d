import type { Db } from '@busbar/db';
import type { LocationScope } from '../access/locations.ts';

/** Shop codes named in a label before "and N more". */
const NAMED_SHOPS = 5;

/** The shops an export covers, in words for its history: the whole network, a region, one shop, or a few named. */
export async function exportScopeLabel(db: Db, scope: LocationScope, regionId: number | undefined): Promise<string> {
  if (scope === 'all') return 'Whole network';
  if (regionId !== undefined) {
    const region = await db.selectFrom('regions').select('name').where('id', '=', regionId).executeTakeFirst();
    if (region) return `${region.name} region (${scope.length} ${scope.length === 1 ? 'shop' : 'shops'})`;
  }
  const shops = await db.selectFrom('locations').select(['code', 'name']).where('id', 'in', scope.length > 0 ? scope : [0]).orderBy('code').execute();
  if (shops.length === 1) return `${shops[0]!.code} ${shops[0]!.name}`;
  const named = shops.slice(0, NAMED_SHOPS).map((s) => s.code).join(', ');
  return `${shops.length} shops: ${named}${shops.length > NAMED_SHOPS ? ` and ${shops.length - NAMED_SHOPS} more` : ''}`;
}
