import { isoDay, localDay } from '@busbar/calc';
import type { Db } from '@busbar/db';
import type { ClaimDetail } from '@busbar/shared';
import type { Agent } from './api-harness.ts';
import { addCustomerWithVehicle } from './build-fixtures.ts';
import { addCatalogItem, addVendor } from './catalog-fixtures.ts';

let serial = 0;

/** A delivered build at a location with one serialized unit on it, straight in the database (with the shop's day of delivery, as the app keeps it). */
export async function addDeliveredUnit(db: Db, locationId: number, { deliveredAt = '2026-03-02T00:00:00.000Z', warrantyMonths = 24 } = {}) {
  const n = ++serial;
  const vendor = await addVendor(db);
  const item = await addCatalogItem(db, { vendorId: vendor.id, warrantyMonths });
  const { customer, vehicle } = await addCustomerWithVehicle(db, locationId);
  const location = await db.selectFrom('locations').select(['code', 'laborRateCents', 'timeZone']).where('id', '=', locationId).executeTakeFirstOrThrow();
  const sequence = 90_000 + n;
  const build = await db
    .insertInto('builds')
    .values({
      locationId,
      sequence,
      number: `${location.code}-${sequence}`,
      customerId: customer.id,
      vehicleId: vehicle.id,
      status: 'delivered',
      leadTechnicianId: null,
      laborHours: 0,
      laborCents: 0,
      partsPriceCents: item.unitPriceCents,
      partsCostCents: item.unitCostCents,
      totalCents: item.unitPriceCents,
      notes: '',
      createdBy: null,
      bookedFor: deliveredAt.slice(0, 10),
      startedAt: deliveredAt,
      deliveredAt,
      // The shop's day of the delivery, as the app keeps it.
      deliveredOn: isoDay(localDay(location.timeZone, Date.parse(deliveredAt))),
      laborRateCents: location.laborRateCents,
      createdAt: deliveredAt,
      updatedAt: deliveredAt,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  const serialNumber = `SN-CLAIM-${n}`;
  const unit = await db
    .insertInto('buildItems')
    .values({ buildId: build.id, catalogItemId: item.id, sku: item.sku, quantity: 1, serialNumber, unitPriceCents: item.unitPriceCents, unitCostCents: item.unitCostCents, createdAt: deliveredAt })
    .returning('id')
    .executeTakeFirstOrThrow();
  return { buildId: build.id, buildItemId: unit.id, serialNumber, vendor, item };
}

/** An 8 × 6 px PNG (a copper swatch), small enough to send in every test. */
export const SMALL_PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAgAAAAGCAIAAABxZ0isAAAAEUlEQVR4nGM4UWqMFTEMpAQAVLJFAbEN4AUAAAAASUVORK5CYII=', 'base64');

/** Uploads a file to a claim as `agent`, the way the browser's form does. */
export const uploadEvidence = (agent: Agent, claimId: number, bytes: Buffer = SMALL_PNG, fileName = 'terminal.png') =>
  agent.post(`/api/claims/${claimId}/evidence`).attach('file', bytes, { filename: fileName, contentType: 'image/png' });

/** A photo up, evidence ready, and the request e-mailed to the vendor, as the clerk does it. */
export async function sendWithEvidence(agent: Agent, claim: ClaimDetail): Promise<ClaimDetail> {
  await uploadEvidence(agent, claim.id);
  const ready = await agent.post(`/api/claims/${claim.id}/status`).send({ version: claim.version, to: 'evidence_ready' });
  if (ready.status !== 200) throw new Error(`evidence_ready answered ${ready.status}: ${JSON.stringify(ready.body)}`);
  const sent = await agent.post(`/api/claims/${claim.id}/send`).send({ version: ready.body.version });
  if (sent.status !== 200) throw new Error(`sending answered ${sent.status}: ${JSON.stringify(sent.body)}`);
  return sent.body as ClaimDetail;
}
