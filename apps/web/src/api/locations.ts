import type { LocationSettings, LocationUpdate, Page } from '@busbar/shared';
import { request } from './client.ts';

export interface LocationFilter {
  q?: string | undefined;
  regionId?: number | undefined;
  page?: number;
  pageSize?: number;
}

/** One page of the locations the person may see, with their region and approval limit. */
export const listLocationSettings = (filter: LocationFilter) => request<Page<LocationSettings>>('/locations/settings', { query: { ...filter } });

export const updateLocation = (id: number, body: LocationUpdate) => request<LocationSettings>(`/locations/${id}`, { method: 'PATCH', body });
