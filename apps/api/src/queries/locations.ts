import type { Db } from '@busbar/db';
import type { LocationView, RegionView } from '@busbar/shared';

export function listRegions(db: Db): Promise<RegionView[]> {
  return db.selectFrom('regions').select(['id', 'code', 'name']).orderBy('name').execute();
}

export function listLocations(db: Db): Promise<LocationView[]> {
  return db.selectFrom('locations').select(['id', 'regionId', 'code', 'name', 'timeZone']).orderBy('name').execute();
}
