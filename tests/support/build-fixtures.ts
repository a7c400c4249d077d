import type { Db } from '@busbar/db';
import type { BuildDetail } from '@busbar/shared';
import type { Agent } from './api-harness.ts';
import { addCatalogItem, addCustomer, addVehicle, addVendor } from './catalog-fixtures.ts';

/** A small shop's worth of catalog: a serialized battery and charger, and fuses sold by the piece. */
export async function addParts(db: Db) {
  const vendor = await addVendor(db);
  const battery = await addCatalogItem(db, { vendorId: vendor.id, unitPriceCents: 89_900, unitCostCents: 61_000 });
  const charger = await addCatalogItem(db, {
    vendorId: vendor.id,
    category: 'dc_dc_charger',
    specs: { outputA: 40 },
    unitPriceCents: 42_500,
    unitCostCents: 27_000,
  });
  const fuse = await addCatalogItem(db, {
    vendorId: vendor.id,
    category: 'fuse_block',
    specs: { circuits: 12, maxA: 100 },
    serialized: false,
    unitPriceCents: 1_250,
    unitCostCents: 410,
  });
  return { vendor, battery, charger, fuse };
}

/** A customer with one vehicle at a location. */
export async function addCustomerWithVehicle(db: Db, locationId: number) {
  const customer = await addCustomer(db, locationId);
  const vehicle = await addVehicle(db, customer);
  return { customer, vehicle };
}

/** Books a draft build through the API as `agent` (a lead of the location) and answers its detail. */
export async function createBuild(
  db: Db,
  agent: Agent,
  locationId: number,
  extra: { leadTechnicianId?: number | null; bookedFor?: string | null; laborHours?: number } = {},
): Promise<BuildDetail> {
  const { customer, vehicle } = await addCustomerWithVehicle(db, locationId);
  const res = await agent.post('/api/builds').send({ locationId, customerId: customer.id, vehicleId: vehicle.id, ...extra });
  if (res.status !== 201) throw new Error(`creating a build answered ${res.status}: ${JSON.stringify(res.body)}`);
  return res.body as BuildDetail;
}

/** Moves a build through the given statuses as `agent`, answering the last detail. */
export async function moveThrough(agent: Agent, build: BuildDetail, statuses: string[]): Promise<BuildDetail> {
  let current = build;
  for (const to of statuses) {
    const res = await agent.post(`/api/builds/${current.id}/status`).send({ version: current.version, to });
    if (res.status !== 200) throw new Error(`moving ${current.number} to ${to} answered ${res.status}: ${JSON.stringify(res.body)}`);
    current = res.body as BuildDetail;
  }
  return current;
}
