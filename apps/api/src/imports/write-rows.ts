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

/**
 * 17:00 on a local date in the location's zone, as a UTC instant (imported deliveries have no time),
 * or `now` if that is earlier: a build delivered today is not delivered later than it is imported.
 */
const deliveredAtOf = (date: string, zone: string, now: string) => {
  const evening = new Date(localMoment(zone, dayOfIso(date), 17 * 60)).toISOString();
  return evening < now ? evening : now;
};

/** What a batch created, so a later batch's failure can take the whole import back. */
interface Written {
  builds: number[];
  customers: number[];
  vehicles: number[];
}

/** Finds the customer by e-mail at the location, or creates one; the same e-mail in a file is one customer. */
async function customerFor(trx: Db, location: ImportLocation, row: CheckedRow['row'], at: string, written: Written): Promise<number> {
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
  written.customers.push(created.id);
  return created.id;
}

/**
 * The customer's vehicle the row names: by its VIN when the row gives one (the one with that VIN,
 * else a new one: a vehicle on file without a VIN may be another of the same model), otherwise the
 * one of the same year, make and model, else a new one. A vehicle on file is never changed.
 */
async function vehicleFor(trx: Db, location: ImportLocation, customerId: number, row: CheckedRow['row'], written: Written): Promise<number> {
  const vehicle = { year: row.vehicle_year, make: row.vehicle_make, model: row.vehicle_model };
  const mine = trx.selectFrom('vehicles').select('id').where('customerId', '=', customerId);
  const existing = await (row.vehicle_vin
    ? mine.where('vin', '=', row.vehicle_vin)
    : mine.where('year', '=', vehicle.year).where('make', '=', vehicle.make).where('model', '=', vehicle.model)
  ).executeTakeFirst();
  if (existing) return existing.id;
  const created = await trx
    .insertInto('vehicles')
    .values({ ...vehicle, customerId, locationId: location.id, bodyStyle: row.vehicle_body_style, vin: row.vehicle_vin, plate: row.vehicle_plate, notes: '' })
    .returning('id')
    .executeTakeFirstOrThrow();
  written.vehicles.push(created.id);
  return created.id;
}

/** Rows per multi-row insert of events and audit entries, well inside SQLite's limit of bound values. */
const CHUNK = 500;

/**
 * How an import takes turns with people's saves for SQLite's one write lock. Measured on the
 * 200-shop network (bench/contention.ts, two runs each): batches of 100 rows held the lock for
 * about 200 ms, and a lead's saves meanwhile waited up to 240 ms (p95 193–238); 80 ms batches and
 * 30 ms pauses: p95 109–119 ms, the 2,000 rows written as fast (5.1–6.2 s); 40 ms and 50 ms: p95
 * 61–114 ms, but 12–13 s, as each commit writes the full-text indexes' new rows out.
 */
export interface Pace {
  /** How long a transaction may go on taking rows: a batch ends at its first row written past it, on any network. */
  batchMs: number;
  /**
   * A pause between batches, so a save waiting on the lock takes it before the next batch does:
   * SQLite's busy handler tries a waiting save again every 20–25 ms by then.
   */
  pauseMs: number;
}

const PACE: Pace = { batchMs: 80, pauseMs: 30 };

/**
 * Writes checked rows as builds of the location, in file order, a batch per transaction (see
 * Pace). When a batch fails (a serial number taken since the rows were checked), the batches
 * before it are taken back, so an import is written whole or not at all; people may see its
 * builds meanwhile.
 */
export async function writeImport(db: Db, location: ImportLocation, rows: CheckedRow[], actorId: number, at: string, pace = PACE): Promise<number> {
  const written: Written = { builds: [], customers: [], vehicles: [] };
  try {
    for (let next = 0; next < rows.length; ) {
      if (next > 0) await new Promise((resolve) => setTimeout(resolve, pace.pauseMs));
      const batch = await db.transaction().execute(async (trx) => {
        const created: Written = { builds: [], customers: [], vehicles: [] };
        const ended = await writeBatch(trx, location, rows, next, performance.now() + pace.batchMs, { actorId, at }, created);
        return { created, ended };
      });
      next = batch.ended;
      for (const key of ['builds', 'customers', 'vehicles'] as const) written[key].push(...batch.created[key]);
    }
  } catch (failure) {
    await db.transaction().execute((trx) => takeBack(trx, written));
    throw failure;
  }
  return rows.length;
}

/** Deletes what earlier batches wrote (lines, events and audit entries of the builds with them). */
async function takeBack(trx: Db, written: Written): Promise<void> {
  for (let i = 0; i < written.builds.length; i += CHUNK) {
    const ids = written.builds.slice(i, i + CHUNK);
    await trx.deleteFrom('auditLog').where('entity', '=', 'build').where('action', '=', 'build.import').where('entityId', 'in', ids).execute();
    await trx.deleteFrom('builds').where('id', 'in', ids).execute();
  }
  // Only those no build refers to: someone may have booked a build for an imported customer meanwhile.
  for (let i = 0; i < written.vehicles.length; i += CHUNK) {
    await trx
      .deleteFrom('vehicles')
      .where('id', 'in', written.vehicles.slice(i, i + CHUNK))
      .where((eb) => eb.not(eb.exists(eb.selectFrom('builds as b').select('b.id').whereRef('b.vehicleId', '=', 'vehicles.id'))))
      .execute();
  }
  for (let i = 0; i < written.customers.length; i += CHUNK) {
    await trx
      .deleteFrom('customers')
      .where('id', 'in', written.customers.slice(i, i + CHUNK))
      .where((eb) => eb.not(eb.exists(eb.selectFrom('builds as b').select('b.id').whereRef('b.customerId', '=', 'customers.id'))))
      .where((eb) => eb.not(eb.exists(eb.selectFrom('vehicles as v').select('v.id').whereRef('v.customerId', '=', 'customers.id'))))
      .execute();
  }
}

/** Writes rows from `first` on until one is written past `until` (performance.now()); answers where the next batch begins. */
async function writeBatch(trx: Db, location: ImportLocation, rows: CheckedRow[], first: number, until: number, by: { actorId: number; at: string }, written: Written): Promise<number> {
  const { actorId, at } = by;
  const events: { buildId: number; line: number; status: CheckedRow['row']['status'] }[] = [];
  const audits: { buildId: number; after: string }[] = [];
  let next = first;
  while (next < rows.length && (next === first || performance.now() < until)) {
    const { row, items, leadTechnicianId, line } = rows[next++]!;
    const customerId = await customerFor(trx, location, row, at, written);
    const vehicleId = await vehicleFor(trx, location, customerId, row, written);
    const { sequence, number } = await nextBuildNumber(trx, location);
    const { marginCents: _, ...totals } = buildTotals(items, row.labor_hours, location.laborRateCents);
    const deliveredAt = row.delivered_on ? deliveredAtOf(row.delivered_on, location.timeZone, at) : null;
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
        deliveredAt,
        deliveredOn: row.delivered_on || null,
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
      // The lines were in the build when it was delivered, not added the day of the import: a unit's
      // life (reliability, the earliest failure a claim may give) starts at the delivery.
      const addedAt = deliveredAt ?? at;
      await trx
        .insertInto('buildItems')
        .values(items.map((i) => ({ buildId: build.id, catalogItemId: i.catalogItemId, sku: i.sku, quantity: i.quantity, serialNumber: i.serialNumber, unitPriceCents: i.unitPriceCents, unitCostCents: i.unitCostCents, createdAt: addedAt })))
        .execute();
    }
    written.builds.push(build.id);
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
  return next;
}
