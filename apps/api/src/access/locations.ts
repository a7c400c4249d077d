import type { Db } from '@busbar/db';
import { subject } from '@casl/ability';
import { forbidden, notFound } from '../errors.ts';
import type { Viewer } from './viewer.ts';

/**
 * The location a person adds a record of `type` at: 404 when they cannot see the location,
 * 403 with `refusal` when they see it but may not add such records there.
 */
export async function locationToAddAt(db: Db, viewer: Viewer, locationId: number, type: 'Build' | 'Customer' | 'Plan', refusal: string) {
  const location = await db.selectFrom('locations').selectAll().where('id', '=', locationId).executeTakeFirst();
  if (!location || !viewer.ability.can('read', subject('Location', { ...location }))) throw notFound('location');
  if (!viewer.ability.can('create', subject(type, { locationId: location.id }))) throw forbidden(refusal);
  return location;
}

/** Every location (people who see the whole network: lists take no location filter), or these ids. */
export type LocationScope = 'all' | number[];

/** The locations `allowed` holds for: 'all' when that is every one. Kept with the cached viewer under `key`. */
function cachedScope(viewer: Viewer, key: string, allowed: (locationId: number) => boolean): LocationScope {
  let scope = viewer.scopes.get(key);
  if (!scope) {
    const ids = viewer.locationIds.filter(allowed);
    scope = ids.length === viewer.locationIds.length ? 'all' : ids;
    viewer.scopes.set(key, scope);
  }
  return scope;
}

/**
 * Where the person may do `action` on records of `type` (or on its `field`): 'all' when that is
 * every location. Worked out once per cached viewer (the network's locations come with it).
 */
export function locationScope(viewer: Viewer, action: 'read' | 'create' | 'export', type: 'Build' | 'Customer' | 'Plan' | 'Claim' | 'Reliability' | 'Report', field?: string): LocationScope {
  return cachedScope(viewer, `${action} ${type} ${field ?? ''}`, (locationId) => viewer.ability.can(action, subject(type, { locationId }), field));
}

/** The locations the person sees (for pickers and labels): 'all', or these ids. Worked out once per cached viewer. */
export function seenLocations(viewer: Viewer): LocationScope {
  return cachedScope(viewer, 'read Location', (id) => viewer.ability.can('read', subject('Location', { id })));
}

/**
 * The scope narrowed to the location and the region a request asks for (both must hold; none of
 * it when out of scope): a list filtered to a shop, or to the region chosen in the header.
 */
export function narrowScope(viewer: Viewer, scope: LocationScope, { locationId, regionId }: { locationId?: number | undefined; regionId?: number | undefined }): LocationScope {
  if (locationId === undefined && regionId === undefined) return scope;
  const ids = scope === 'all' ? viewer.locationIds : scope;
  return ids.filter((id) => (locationId === undefined || id === locationId) && (regionId === undefined || viewer.regionOf.get(id) === regionId));
}

/**
 * A report's locations: those in `readable` within the shop or region asked for. Refused with
 * `refusals.none` when the person reads none at all, `refusals.outside` when none lies within.
 */
export function reportWithin(viewer: Viewer, readable: LocationScope, within: { locationId?: number | undefined; regionId?: number | undefined }, refusals: { none: string; outside: string }): LocationScope {
  if (readable !== 'all' && readable.length === 0) throw forbidden(refusals.none);
  const scope = narrowScope(viewer, readable, within);
  if (scope !== 'all' && scope.length === 0) throw forbidden(refusals.outside);
  return scope;
}
