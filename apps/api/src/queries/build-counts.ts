import type { Db } from '@busbar/db';
import { COUNT_CAP, type BuildQuery, type BuildStatus } from '@busbar/shared';
import type { LocationScope } from '../access/locations.ts';
import type { Count } from './paging.ts';

/** What a build list is asked besides its filters (its paging and order), and the shops and statuses the kept counts go by. */
const SHOPS_STATUSES_AND_PAGING = new Set(['status', 'locationId', 'regionId', 'sort', 'order', 'page', 'pageSize', 'cursor']);

/** Whether nothing but its shops and statuses narrows the list: the kept counts (migration 061) then count it. */
export function countedByShopAndStatus(query: BuildQuery): boolean {
  return Object.entries(query).every(([key, value]) => value === undefined || value === '' || SHOPS_STATUSES_AND_PAGING.has(key));
}

/** How many builds the locations of `scope` hold in `statuses` (in any, when none), from the kept counts, up to `cap`. */
export async function keptBuildCount(db: Db, scope: LocationScope, statuses: readonly BuildStatus[], cap = COUNT_CAP): Promise<Count> {
  let counts = db.selectFrom('buildCounts').select((eb) => eb.fn.coalesce(eb.fn.sum<number>('builds'), eb.lit(0)).as('n'));
  if (scope !== 'all') counts = counts.where('locationId', 'in', scope);
  if (statuses.length > 0) counts = counts.where('status', 'in', statuses);
  const { n } = await counts.executeTakeFirstOrThrow();
  return { total: Math.min(Number(n), cap), totalCapped: Number(n) > cap };
}
