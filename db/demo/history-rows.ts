import { buildTotals } from '@busbar/calc';
import type { Insertable } from 'kysely';
import type { Database } from '../schema/index.ts';
import type { Random } from './draw.ts';
import { isoDay, localDay } from '@busbar/calc';
import { atTheTime, serialNumbers } from './serials.ts';
import { auditRows } from './history-audit.ts';
import type { SimBuild, SimCustomer, SimVehicle } from './shop-history.ts';
import type { StatusEvent } from './timeline.ts';
import { vehicleIdentity } from './vehicles.ts';

export interface CatalogEntry {
  id: number;
  serialized: boolean;
  serialPrefix: string;
  unitPriceCents: number;
  unitCostCents: number;
}

type Rows<T extends keyof Database> = Insertable<Database[T]>[];
export interface HistoryRows {
  customers: Rows<'customers'>;
  vehicles: Rows<'vehicles'>;
  builds: Rows<'builds'>;
  buildItems: Rows<'buildItems'>;
  buildEvents: Rows<'buildEvents'>;
  auditLog: Rows<'auditLog'>;
}

const YEAR_MS = 365.25 * 86_400_000;
const iso = (ms: number) => new Date(ms).toISOString();
const byCreation = <T extends { createdAt: number }>(items: T[]) => [...items].sort((a, b) => a.createdAt - b.createdAt);

/** Turns simulated builds into table rows, batch after batch; ids, build numbers and serials carry on across batches. */
export function historyRowMaker(
  random: Random,
  catalog: ReadonlyMap<string, CatalogEntry>,
  firstId: { customer: number; vehicle: number; build: number },
  nowMs: number,
  options: { audit?: boolean } = {},
): (builds: SimBuild[]) => HistoryRows {
  const customerIds = new Map<SimCustomer, number>();
  const vehicleIds = new Map<SimVehicle, number>();
  const serial = serialNumbers(random);
  const sequences = new Map<number, number>();
  let nextBuildId = firstId.build;

  return (batch) => {
    const rows: HistoryRows = { customers: [], vehicles: [], builds: [], buildItems: [], buildEvents: [], auditLog: [] };
    /** A vehicle as first seen, `atMs`: its odometer is read then. */
    const addVehicle = (vehicle: SimVehicle, customerId: number, atMs: number) => {
      const vehicleId = firstId.vehicle + vehicleIds.size;
      vehicleIds.set(vehicle, vehicleId);
      const { year, bodyStyle, make, model } = vehicle;
      const identity = vehicleIdentity(vehicleId, vehicle, isoDay(localDay(vehicle.customer.shop.timeZone, atMs)));
      rows.vehicles.push({ id: vehicleId, customerId, locationId: vehicle.customer.shop.id, year, bodyStyle, make, model, notes: '', ...identity });
    };
    const builds = byCreation(batch);
    // Customers in the order they came in, each with the vehicles known by then; a later vehicle comes with its first build.
    const newCustomers = [...new Set(builds.map((b) => b.customer).filter((c) => !customerIds.has(c)))];
    for (const customer of newCustomers.sort((a, b) => a.createdAt - b.createdAt || a.shop.id - b.shop.id)) {
      const { shop, createdAt, vehicles, ...fields } = customer;
      const id = firstId.customer + customerIds.size;
      customerIds.set(customer, id);
      rows.customers.push({ id, locationId: shop.id, ...fields, createdAt: iso(createdAt) });
      for (const vehicle of vehicles) addVehicle(vehicle, id, createdAt);
    }
    for (const build of builds) {
      const { shop, events, customer } = build;
      if (!vehicleIds.has(build.vehicle)) addVehicle(build.vehicle, customerIds.get(customer)!, build.createdAt);
      const buildId = nextBuildId++;
      const sequence = (sequences.get(shop.id) ?? 0) + 1;
      sequences.set(shop.id, sequence);
      const startedAt = events.find((e) => e.to === 'in_bay')?.at ?? null;
      const deliveredAt = events.find((e) => e.to === 'delivered')?.at ?? null;
      const createdAt = iso(build.createdAt);
      const yearsAgo = (nowMs - build.createdAt) / YEAR_MS;
      const items = build.job.lines.flatMap(({ sku, quantity }) => {
        const item = catalog.get(sku);
        if (!item) throw new Error(`demo job uses unknown SKU ${sku}`);
        const line = {
          buildId,
          catalogItemId: item.id,
          sku,
          unitPriceCents: atTheTime(item.unitPriceCents, yearsAgo, 100),
          unitCostCents: atTheTime(item.unitCostCents, yearsAgo, 1),
          createdAt,
        };
        if (!item.serialized) return [{ ...line, quantity, serialNumber: null }];
        // Each serialized unit is its own line; its serial is read off the unit when it goes in.
        return Array.from({ length: quantity }, () => ({
          ...line,
          quantity: 1,
          serialNumber: startedAt === null ? null : serial(sku, item.serialPrefix, startedAt),
        }));
      });
      const totals = buildTotals(items, build.laborHours, shop.laborRateCents);
      rows.buildItems.push(...items);
      const actor = (e: StatusEvent) => (e.by === 'lead' ? shop.leadId : build.leadTechnicianId);
      rows.buildEvents.push(
        ...events.map((e) => ({ buildId, at: iso(e.at), actorId: actor(e), kind: 'status' as const, fromStatus: e.from, toStatus: e.to, note: e.note })),
      );
      const booked = events.some((e) => e.to === 'booked');
      const number = `${shop.code}-${String(sequence).padStart(5, '0')}`;
      rows.builds.push({
        id: buildId,
        locationId: shop.id,
        sequence,
        number,
        customerId: customerIds.get(customer)!,
        vehicleId: vehicleIds.get(build.vehicle)!,
        status: events[events.length - 1]!.to,
        leadTechnicianId: build.leadTechnicianId,
        bookedFor: booked && build.bookedForDay !== null ? isoDay(build.bookedForDay) : null,
        startedAt: startedAt === null ? null : iso(startedAt),
        deliveredAt: deliveredAt === null ? null : iso(deliveredAt),
        deliveredOn: deliveredAt === null ? null : isoDay(localDay(shop.timeZone, deliveredAt)),
        laborHours: build.laborHours,
        laborRateCents: shop.laborRateCents,
        laborCents: totals.laborCents,
        partsPriceCents: totals.partsPriceCents,
        partsCostCents: totals.partsCostCents,
        totalCents: totals.totalCents,
        notes: build.job.notes,
        createdAt,
        updatedAt: iso(events[events.length - 1]!.at),
        createdBy: shop.leadId,
      });
      if (options.audit) rows.auditLog.push(...auditRows(build, buildId, number, items));
    }
    return rows;
  };
}

/** Rows of the simulated history, numbered from `firstId` on, in the order things happened, with the audit trail the API would have written. */
export function historyRows(
  random: Random,
  sim: { builds: SimBuild[] },
  catalog: ReadonlyMap<string, CatalogEntry>,
  firstId: { customer: number; vehicle: number; build: number },
  nowMs: number,
): HistoryRows {
  return historyRowMaker(random, catalog, firstId, nowMs, { audit: true })(sim.builds);
}
