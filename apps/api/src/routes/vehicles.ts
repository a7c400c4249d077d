import { subject } from '@casl/ability';
import { idParams, vehicleBody, vehicleUpdate, type VehicleView } from '@busbar/shared';
import { Router } from 'express';
import { readable } from '../access/fields.ts';
import type { AppContext } from '../context.ts';
import { forbidden, HttpError, notFound, stale } from '../errors.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { writeAudit } from '../queries/audit.ts';
import { findCustomer } from '../queries/customers.ts';
import { findVehicle, insertVehicle, readingDay, updateVehicle } from '../queries/vehicles.ts';

const lowersMileage = (before: VehicleView, mileage: number | null | undefined) =>
  mileage != null && before.mileage !== null && mileage < before.mileage;

/** An odometer rarely goes back (a replaced cluster); a typo often does, so a lower reading is confirmed first. */
const lowerMileage = (before: VehicleView) =>
  new HttpError(409, 'mileage_lower', `The odometer read ${before.mileage!.toLocaleString('en-US')} miles on ${before.mileageReadOn ?? 'an earlier visit'}. Save again to confirm the lower reading.`, {
    mileage: 'Lower than the miles on file',
  });

/** Customers' vehicles; each belongs to its customer's location. They are read with the customer. */
export function vehiclesRouter({ db, now }: AppContext): Router {
  const router = Router();

  router.post(
    '/',
    validate({ body: vehicleBody }, async ({ body }, req, res) => {
      const viewer = viewerOf(req);
      const customer = await findCustomer(db, body.customerId);
      if (!customer || !viewer.ability.can('read', subject('Customer', { ...customer }))) throw notFound('customer');
      if (!viewer.ability.can('create', subject('Vehicle', { locationId: customer.locationId }))) throw forbidden('You cannot add vehicles at this location');
      const vehicle = await db.transaction().execute(async (trx) => {
        const today = await readingDay(trx, customer.locationId, now());
        const after = (await findVehicle(trx, await insertVehicle(trx, body, customer.locationId, today)))!;
        await writeAudit(trx, { at: now().toISOString(), actorId: viewer.id, action: 'vehicle.create', entity: 'vehicle', entityId: after.id, after });
        return after;
      });
      res.status(201).json(readable(viewer.ability, 'Vehicle', vehicle));
    }),
  );

  router.put(
    '/:id',
    validate({ params: idParams, body: vehicleUpdate }, async ({ params, body: { version, confirmLowerMileage, ...fields } }, req, res) => {
      const viewer = viewerOf(req);
      const vehicle = await db.transaction().execute(async (trx) => {
        const before = await findVehicle(trx, params.id);
        if (!before || !viewer.ability.can('read', subject('Vehicle', { ...before }))) throw notFound('vehicle');
        if (!viewer.ability.can('update', subject('Vehicle', { ...before }))) throw forbidden('You cannot change vehicles at this location');
        if (!confirmLowerMileage && lowersMileage(before, fields.mileage)) throw lowerMileage(before);
        if (!(await updateVehicle(trx, before, version, fields, await readingDay(trx, before.locationId, now())))) throw stale();
        const after = (await findVehicle(trx, before.id))!;
        await writeAudit(trx, { at: now().toISOString(), actorId: viewer.id, action: 'vehicle.update', entity: 'vehicle', entityId: before.id, before, after });
        return after;
      });
      res.json(readable(viewer.ability, 'Vehicle', vehicle));
    }),
  );

  return router;
}
