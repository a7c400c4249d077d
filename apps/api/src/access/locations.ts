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
