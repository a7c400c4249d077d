import { addMonthsIso, isoDay, localDay } from '@busbar/calc';
import type { Db } from '@busbar/db';
import { subject } from '@casl/ability';
import type { ClaimCreate } from '@busbar/shared';
import { forbidden, invalidField, notFound } from '../errors.ts';
import type { Viewer } from './viewer.ts';

/**
 * The installed unit a new claim is for, checked: a line of a delivered build the person may read,
 * at a location where they may log claims, failed between its delivery and today. Past its
 * warranty months only goodwill is possible, and only for someone who may approve claims there.
 */
export async function unitToClaim(db: Db, viewer: Viewer, body: ClaimCreate, now: Date) {
  const unit = await db
    .selectFrom('buildItems as i')
    .innerJoin('builds as b', 'b.id', 'i.buildId')
    .innerJoin('catalogItems as ci', 'ci.id', 'i.catalogItemId')
    .innerJoin('locations as l', 'l.id', 'b.locationId')
    .select(['i.id', 'i.buildId', 'i.catalogItemId', 'i.createdAt', 'b.locationId', 'l.code', 'l.timeZone', 'b.status', 'b.deliveredAt', 'ci.warrantyMonths'])
    .where('i.id', '=', body.buildItemId)
    .executeTakeFirst();
  if (!unit || !viewer.ability.can('read', subject('Build', { locationId: unit.locationId }))) throw notFound('component');
  const target = subject('Claim', { locationId: unit.locationId, aboveLimit: false });
  if (!viewer.ability.can('create', target)) throw forbidden('You cannot log warranty claims at this location');
  if (unit.status !== 'delivered' || !unit.deliveredAt) throw invalidField('buildItemId', 'Only components of a delivered build can be claimed');
  const deliveredOn = isoDay(localDay(unit.timeZone, Date.parse(unit.deliveredAt)));
  const today = isoDay(localDay(unit.timeZone, now.getTime()));
  if (body.failedOn < deliveredOn) throw invalidField('failedOn', `The unit was delivered on ${deliveredOn}: it cannot have failed before`);
  // A unit put in after delivery (a replacement, a correction) starts its life on the day it was added.
  const addedOn = isoDay(localDay(unit.timeZone, Date.parse(unit.createdAt)));
  if (addedOn > deliveredOn && body.failedOn < addedOn) throw invalidField('failedOn', `The unit was put in on ${addedOn}: it cannot have failed before`);
  if (body.failedOn > today) throw invalidField('failedOn', 'The failure date cannot be in the future');
  const warrantyEnds = addMonthsIso(deliveredOn, unit.warrantyMonths);
  const outOfWarranty = body.failedOn > warrantyEnds;
  if (outOfWarranty && body.coverage !== 'goodwill')
    throw invalidField('coverage', `The unit's warranty ended on ${warrantyEnds}: only a goodwill claim is possible`);
  if (outOfWarranty && !viewer.ability.can('approve', target)) throw forbidden(`The unit's warranty ended on ${warrantyEnds}: a location lead may log it as goodwill`);
  return { ...unit, outOfWarranty };
}
