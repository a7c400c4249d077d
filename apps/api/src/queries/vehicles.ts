import { isoDay, localDay } from '@busbar/calc';
import type { Db } from '@busbar/db';
import type { VehicleBody, VehicleUpdate, VehicleView } from '@busbar/shared';

const VEHICLE_COLUMNS = [
  'id', 'customerId', 'locationId', 'year', 'bodyStyle', 'make', 'model', 'notes', 'vin', 'plate', 'mileage', 'mileageReadOn', 'version',
] as const;

type VehicleFields = Omit<VehicleUpdate, 'version' | 'confirmLowerMileage'>;

const vehicles = (db: Db) => db.selectFrom('vehicles').select(VEHICLE_COLUMNS).$narrowType<{ bodyStyle: VehicleView['bodyStyle'] }>();

/** A customer's vehicles, newest model year first. */
export function vehiclesOf(db: Db, customerId: number): Promise<VehicleView[]> {
  return vehicles(db).where('customerId', '=', customerId).orderBy('year', 'desc').orderBy('id').execute();
}

export function findVehicle(db: Db, id: number): Promise<VehicleView | undefined> {
  return vehicles(db).where('id', '=', id).executeTakeFirst();
}

/** Today at the location, the day an odometer read now is recorded as read. */
export async function readingDay(db: Db, locationId: number, now: Date): Promise<string> {
  const { timeZone } = await db.selectFrom('locations').select('timeZone').where('id', '=', locationId).executeTakeFirstOrThrow();
  return isoDay(localDay(timeZone, now.getTime()));
}

/** A vehicle belongs to its customer's location, so every vehicle query is scoped without a join. */
export async function insertVehicle(db: Db, body: VehicleBody, locationId: number, today: string): Promise<number> {
  const mileageReadOn = body.mileage == null ? null : today;
  const row = await db.insertInto('vehicles').values({ ...body, locationId, mileageReadOn }).returning('id').executeTakeFirstOrThrow();
  return row.id;
}

/**
 * Writes an edit made against `version`; false when the vehicle has changed since. A new odometer
 * reading is dated today; a field left out keeps what is on file.
 */
export async function updateVehicle(db: Db, before: VehicleView, version: number, fields: VehicleFields, today: string): Promise<boolean> {
  const read = fields.mileage !== undefined && fields.mileage !== before.mileage;
  const mileageReadOn = read ? (fields.mileage === null ? null : today) : undefined;
  const result = await db
    .updateTable('vehicles')
    .set((eb) => ({ ...fields, mileageReadOn, version: eb('version', '+', 1) }))
    .where('id', '=', before.id)
    .where('version', '=', version)
    .executeTakeFirst();
  return result.numUpdatedRows > 0n;
}
