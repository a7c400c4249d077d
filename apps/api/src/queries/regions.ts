import type { Db } from '@busbar/db';

type LocationRegion = { id: number; regionId: number };

/** Every location with its region, to read the sums kept per region for regions wholly in a scope. */
export const locationRegions = (db: Db): Promise<LocationRegion[]> => db.selectFrom('locations').select(['id', 'regionId']).execute();

/**
 * The regions `scope` is made of when it holds every location of each region it touches (a
 * regional manager's scope), so that the sums kept per region stand in for its locations';
 * otherwise null.
 */
export function regionsMadeOf(locations: readonly LocationRegion[], scope: readonly number[]): number[] | null {
  const chosen = new Set(scope);
  const touched = new Set(locations.filter((l) => chosen.has(l.id)).map((l) => l.regionId));
  if (touched.size === 0 || locations.some((l) => touched.has(l.regionId) && !chosen.has(l.id))) return null;
  return [...touched];
}

/** regionsMadeOf with the locations as they stand. */
export const wholeRegions = async (db: Db, scope: readonly number[]): Promise<number[] | null> => regionsMadeOf(await locationRegions(db), scope);
