import type { LocationComparison, Rollups, RollupQuery } from '@busbar/shared';
import { request } from './client.ts';

/** Each location of the person's scope over whole months (YYYY-MM), beside the network's medians. */
export const compareLocations = (from: string, to: string) => request<LocationComparison>('/rollups/locations', { query: { from, to } });

export const getRollups = (query: RollupQuery) => request<Rollups>('/rollups', { query: { ...query } });
