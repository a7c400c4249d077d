import type { Db } from '@busbar/db';
import { HttpError } from '../errors.ts';
import { buildLeadsAt } from '../queries/assignments.ts';

interface References {
  customerId?: number | undefined;
  vehicleId?: number | undefined;
  leadTechnicianId?: number | null | undefined;
}

/**
 * Checks that a build's customer, vehicle and lead technician belong to its location (and the
 * vehicle to the customer); a bad reference is a 400 naming the field.
 */
export async function checkBuildReferences(db: Db, locationId: number, refs: References, current?: { customerId: number; vehicleId: number }): Promise<void> {
  const fields: Record<string, string> = {};
  const customerId = refs.customerId ?? current?.customerId;
  const vehicleId = refs.vehicleId ?? current?.vehicleId;
  if (refs.customerId !== undefined) {
    const customer = await db.selectFrom('customers').select('locationId').where('id', '=', refs.customerId).executeTakeFirst();
    if (customer?.locationId !== locationId) fields.customerId = 'Choose a customer of this location';
  }
  if ((refs.vehicleId !== undefined || refs.customerId !== undefined) && !fields.customerId) {
    const vehicle = await db.selectFrom('vehicles').select('customerId').where('id', '=', vehicleId!).executeTakeFirst();
    if (vehicle?.customerId !== customerId) fields.vehicleId = "Choose one of this customer's vehicles";
  }
  if (refs.leadTechnicianId) {
    const leads = await buildLeadsAt(db, locationId);
    if (!leads.some((p) => p.id === refs.leadTechnicianId)) fields.leadTechnicianId = 'Choose a technician of this location';
  }
  if (Object.keys(fields).length > 0) throw new HttpError(400, 'invalid', 'Some fields need attention', fields);
}
