import { RELIABILITY_GROUPS, type ReliabilityGroup } from '@busbar/shared';
import type { LocationQuery, LocationQueryRaw } from 'vue-router';
import type { ReliabilityFilter } from '../../api/reliability.ts';

const month = (value: unknown) => (typeof value === 'string' && /^\d{4}-(0[1-9]|1[0-2])$/.test(value) ? value : undefined);

/** "3,12" from the address bar as location ids; anything else is dropped. */
function idList(value: unknown): number[] {
  if (typeof value !== 'string') return [];
  const ids = value.split(',').map(Number).filter((id) => Number.isInteger(id) && id > 0);
  return [...new Set(ids)];
}

/** The months and locations as the address bar holds them; a range the wrong way round keeps only its start. */
export function readReliabilityFilter(query: LocationQuery): ReliabilityFilter {
  const from = month(query.from);
  const to = month(query.to);
  return { from, to: from && to && to < from ? undefined : to, locationIds: idList(query.locations) };
}

export function readGroupBy(value: unknown): ReliabilityGroup {
  return RELIABILITY_GROUPS.find((g) => g === value) ?? 'item';
}

/** The filter as address-bar query, leaving out what is not set. */
export function filterQuery(filter: ReliabilityFilter): LocationQueryRaw {
  const query: LocationQueryRaw = {};
  if (filter.from) query.from = filter.from;
  if (filter.to) query.to = filter.to;
  if (filter.locationIds.length) query.locations = filter.locationIds.join(',');
  return query;
}

export const GROUP_LABELS: Record<ReliabilityGroup, string> = { item: 'Item', category: 'Category', vendor: 'Vendor' };
