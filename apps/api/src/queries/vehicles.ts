import type { Db } from '@busbar/db';
import type { VehicleBody, VehicleView } from '@busbar/shared';

const VEHICLE_COLUMNS = ['id', 'customerId', 'locationId', 'year', 'bodyStyle', 'make', 'model', 'notes', 'version'] as const;

type VehicleFields = Omit<VehicleBody, 'customerId'>;

const vehicles = (db: Db) => db.selectFrom('vehicles').select(VEHICLE_COLUMNS).$narrowType<{ bodyStyle: VehicleView['bodyStyle'] }>();

/** A customer's vehicles, newest model year first. */
export function vehiclesOf(db: Db, customerId: number): Promise<VehicleView[]> {
  return vehicles(db).where('customerId', '=', customerId).orderBy('year', 'desc').orderBy('id').execute();
}

export function findVehicle(db: Db, id: number): Promise<VehicleView | undefined> {
  return vehicles(db).where('id', '=', id).executeTakeFirst();
}

/** A vehicle belongs to its customer's location, so every vehicle query is scoped without a join. */
export async function insertVehicle(db: Db, body: VehicleBody, locationId: number): Promise<number> {
  const row = await db.insertInto('vehicles').values({ ...body, locationId }).returning('id').executeTakeFirstOrThrow();
  return row.id;
}

/** Writes an edit made against `version`; false when the vehicle has changed since. */
export async function updateVehicle(db: Db, id: number, version: number, fields: VehicleFields): Promise<boolean> {
  const result = await db
    .updateTable('vehicles')
    .set((eb) => ({ ...fields, version: eb('version', '+', 1) }))
    .where('id', '=', id)
    .where('version', '=', version)
    .executeTakeFirst();
  return result.numUpdatedRows > 0n;
}
