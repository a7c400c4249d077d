import { BUILD_SORTS, BUILD_STATUSES, type BuildStatus, type BuildView } from '@busbar/shared';
import type { LocationQuery } from 'vue-router';
import type { BuildSort } from '../../api/builds.ts';
import { positiveInt } from '../../composables/usePagedList.ts';

const isoDate = (value: unknown) => (typeof value === 'string' && /^\d{4}-\d{2}-\d{2}$/.test(value) ? value : undefined);

/**
 * The build list's filters and order as the address bar holds them; anything unknown is dropped.
 * A list narrowed to days of delivery is a list of deliveries: it is read by delivery day unless
 * another order is asked, and only it can be (the day is blank for builds not delivered).
 */
export function readBuildFilters(query: LocationQuery) {
  const statuses = ([] as unknown[]).concat(query.status ?? []);
  const q = typeof query.q === 'string' ? query.q.trim() : '';
  const deliveredFrom = isoDate(query.deliveredFrom);
  const deliveredTo = isoDate(query.deliveredTo);
  const byDeliveryDays = Boolean(deliveredFrom || deliveredTo);
  const sort = BUILD_SORTS.find((s) => s === query.sort && (s !== 'deliveredOn' || byDeliveryDays));
  return {
    status: BUILD_STATUSES.filter((s) => statuses.includes(s)) as BuildStatus[],
    locationId: positiveInt(query.locationId),
    technicianId: positiveInt(query.technicianId),
    from: isoDate(query.from),
    to: isoDate(query.to),
    deliveredFrom,
    deliveredTo,
    q: q || undefined,
    sort: (sort ?? (byDeliveryDays ? 'deliveredOn' : 'updatedAt')) as BuildSort,
    order: query.order === 'asc' ? ('asc' as const) : ('desc' as const),
  };
}

export type BuildFilters = ReturnType<typeof readBuildFilters>;

/** Whether any filter narrows the list (the order does not count). */
export function isFiltered(f: BuildFilters): boolean {
  return f.status.length > 0 || Boolean(f.locationId || f.technicianId || f.from || f.to || f.deliveredFrom || f.deliveredTo || f.q);
}

/**
 * The VIN or plate a build was found by, in words ("VIN 1M8GDM9AXKP042788"), or null: the list
 * shows year, make and model, which alone would not say why a search for a plate found the build.
 * The search matches any part of either, letter case aside, as this does.
 */
export function foundByVehicle(build: Pick<BuildView, 'vehicleVin' | 'vehiclePlate'>, q: string | undefined): string | null {
  const text = q?.trim().toUpperCase();
  if (!text) return null;
  if (build.vehicleVin?.includes(text)) return `VIN ${build.vehicleVin}`;
  if (build.vehiclePlate?.includes(text)) return `Plate ${build.vehiclePlate}`;
  return null;
}
