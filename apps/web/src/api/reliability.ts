import type { ReliabilityDetail, ReliabilityGroup, ReliabilityList } from '@busbar/shared';
import { request } from './client.ts';

/** Units installed from and to these months (YYYY-MM), at these locations (all the person sees when empty). */
export interface ReliabilityFilter {
  from?: string;
  to?: string;
  locationIds: number[];
}

const queryOf = (f: ReliabilityFilter) => ({ from: f.from, to: f.to, locationIds: f.locationIds.join(',') });

export const listReliability = (groupBy: ReliabilityGroup, filter: ReliabilityFilter) =>
  request<ReliabilityList>('/reliability', { query: { groupBy, ...queryOf(filter) } });

export const getReliability = (groupBy: ReliabilityGroup, key: string, filter: ReliabilityFilter) =>
  request<ReliabilityDetail>(`/reliability/${groupBy}/${encodeURIComponent(key)}`, { query: queryOf(filter) });
