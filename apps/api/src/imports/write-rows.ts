import { buildTotals, dayOfIso, localMoment } from '@busbar/calc';
import type { Db } from '@busbar/db';
import { nextBuildNumber } from '../queries/builds.ts';
import type { CheckedRow } from './check-rows.ts';

/** What an import needs of its location (plain data: it crosses into the import's worker thread). */
export interface ImportLocation {
  id: number;
  code: string;
  timeZone: string;
  laborRateCents: number;
}

/** 17:00 on a local date in the location's zone, as a UTC instant: imported deliveries have no time. */
const localEvening = (date: string, zone: string) => new Date(localMoment(zone, dayOfIso(date), 17 * 60)).toISOString();

/** Finds the customer by e-mail at the location, or creates one; the same e-mail in a file is one customer. */
async function customerFor(trx: Db, location: ImportLocation, row: CheckedRow['row'], at: string): Promise<number> {
  if (row.customer_email) {
    const existing = await trx.selectFrom('customers').select('id').where('locationId', '=', location.id).where('email', '=', row.customer_email).executeTakeFirst();
    if (existing) return existing.id;
  }
  const created = await trx
    .insertInto('customers')
    .values({
      locationId: location.id,
      name: row.customer_name,
      email: row.customer_email,
      phone: row.customer_phone,
      addressLine1: '',
      addressLine2: '',
      city: '',
      region: '',
      postalCode: '',
      notes: '',
      createdAt: at,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  return created.id;
}

async function vehicleFor(trx: Db, location: ImportLocation, customerId: number, row: CheckedRow['row']): Promise<number> {
  const vehicle = { year: row.vehicle_year, make: row.vehicle_make, model: row.vehicle_model };
  const existing = await trx
    .selectFrom('vehicles')
    .select('id')
    .where('customerId', '=', customerId)
    .where('year', '=', vehicle.year)
    .where('make', '=', vehicle.make)
    .where('model', '=', vehicle.model)
    .executeTakeFirst();
  if (existing) return existing.id;
  const created = await trx
    .insertInto('vehicles')
    .values({ ...vehicle, customerId, locationId: location.id, bodyStyle: row.vehicle_body_style, notes: '' })
    .returning('id')
    .executeTakeFirstOrThrow();
  return created.id;
}

/** Rows per multi-row insert of events and audit entries, well inside SQLite's limit of bound values. */
const CHUNK = 500;

/**
 * Writes checked rows as builds of the location, in file order; call inside one transaction.
 * Totals come from the lines in hand (`buildTotals`), and the timeline events and audit entries
 * are written together at the end, so the transaction, which holds the write lock, stays short.
 */
export async function writeImport(trx: Db, location: ImportLocation, rows: CheckedRow[], actorId: number, at: string): Promise<number> {
  const events: { buildId: number; line: number; status: CheckedRow['row']['status'] }[] = [];
  const audits: { buildId: number; after: string }[] = [];
  for (const { row, items, leadTechnicianId, line } of rows) {
    const customerId = await customerFor(trx, location, row, at);
    const vehicleId = await vehicleFor(trx, location, customerId, row);
    const { sequence, number } = await nextBuildNumber(trx, location);
    const { marginCents: _, ...totals } = buildTotals(items, row.labor_hours, location.laborRateCents);
    const build = await trx
      .insertInto('builds')
      .values({
        locationId: location.id,
        sequence,
        number,
        customerId,
        vehicleId,
        status: row.status,
        leadTechnicianId,
        bookedFor: row.booked_for || null,
        startedAt: null,
        deliveredAt: row.delivered_on ? localEvening(row.delivered_on, location.timeZone) : null,
        laborHours: row.labor_hours,
        laborRateCents: location.laborRateCents,
        ...totals,
        notes: row.notes,
        createdAt: at,
        updatedAt: at,
        createdBy: actorId,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    if (items.length > 0) {
      await trx
        .insertInto('buildItems')
        .values(items.map((i) => ({ buildId: build.id, catalogItemId: i.catalogItemId, sku: i.sku, quantity: i.quantity, serialNumber: i.serialNumber, unitPriceCents: i.unitPriceCents, unitCostCents: i.unitCostCents, createdAt: at })))
        .execute();
    }
    events.push({ buildId: build.id, line, status: row.status });
    audits.push({ buildId: build.id, after: JSON.stringify({ number, line, ...row }) });
  }
  for (let i = 0; i < events.length; i += CHUNK) {
    const chunk = events.slice(i, i + CHUNK);
    await trx
      .insertInto('buildEvents')
      .values(chunk.map((e) => ({ buildId: e.buildId, at, actorId, kind: 'status' as const, fromStatus: null, toStatus: e.status, note: `Imported from line ${e.line}` })))
      .execute();
    await trx
      .insertInto('auditLog')
      .values(audits.slice(i, i + CHUNK).map((a) => ({ at, actorId, action: 'build.import', entity: 'build', entityId: a.buildId, before: null, after: a.after })))
      .execute();
  }
  return rows.length;
}
