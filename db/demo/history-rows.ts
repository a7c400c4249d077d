import { buildTotals } from '@busbar/calc';
import type { Insertable } from 'kysely';
import type { Database } from '../schema/index.ts';
import type { Random } from './draw.ts';
import { isoDay } from '@busbar/calc';
import { atTheTime, serialNumbers } from './serials.ts';
import type { SimBuild, SimCustomer, SimVehicle } from './shop-history.ts';

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
}

const YEAR_MS = 365.25 * 86_400_000;
const iso = (ms: number) => new Date(ms).toISOString();
const byCreation = <T extends { createdAt: number }>(items: T[]) => [...items].sort((a, b) => a.createdAt - b.createdAt);

/** Rows of the simulated history, numbered from `firstId` on, in the order things happened. */
export function historyRows(
  random: Random,
  sim: { customers: SimCustomer[]; builds: SimBuild[] },
  catalog: ReadonlyMap<string, CatalogEntry>,
  firstId: { customer: number; vehicle: number; build: number },
  nowMs: number,
): HistoryRows {
  const rows: HistoryRows = { customers: [], vehicles: [], builds: [], buildItems: [], buildEvents: [] };
  const customerIds = new Map<SimCustomer, number>();
  const vehicleIds = new Map<SimVehicle, number>();
  for (const customer of byCreation(sim.customers)) {
    const { shop, createdAt, vehicles, ...fields } = customer;
    const id = firstId.customer + customerIds.size;
    customerIds.set(customer, id);
    rows.customers.push({ id, locationId: shop.id, ...fields, createdAt: iso(createdAt) });
    for (const vehicle of vehicles) {
      const vehicleId = firstId.vehicle + vehicleIds.size;
      vehicleIds.set(vehicle, vehicleId);
      const { year, bodyStyle, make, model } = vehicle;
      rows.vehicles.push({ id: vehicleId, customerId: id, locationId: shop.id, year, bodyStyle, make, model, notes: '' });
    }
  }

  const serial = serialNumbers(random);
  const sequences = new Map<number, number>();
  for (const [index, build] of byCreation(sim.builds).entries()) {
    const { shop, events } = build;
    const buildId = firstId.build + index;
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
    rows.buildEvents.push(
      ...events.map((e) => ({
        buildId,
        at: iso(e.at),
        actorId: e.by === 'lead' ? shop.leadId : build.leadTechnicianId,
        kind: 'status' as const,
        fromStatus: e.from,
        toStatus: e.to,
        note: e.note,
      })),
    );
    const booked = events.some((e) => e.to === 'booked');
    rows.builds.push({
      id: buildId,
      locationId: shop.id,
      sequence,
      number: `${shop.code}-${String(sequence).padStart(5, '0')}`,
      customerId: customerIds.get(build.customer)!,
      vehicleId: vehicleIds.get(build.vehicle)!,
      status: events[events.length - 1]!.to,
      leadTechnicianId: build.leadTechnicianId,
      bookedFor: booked && build.bookedForDay !== null ? isoDay(build.bookedForDay) : null,
      startedAt: startedAt === null ? null : iso(startedAt),
      deliveredAt: deliveredAt === null ? null : iso(deliveredAt),
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
  }
  return rows;
}
