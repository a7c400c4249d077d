import type { LocationComparison, Rollups, RollupQuery } from '@busbar/shared';
import type { ScopeParams } from '../stores/scope.ts';
import { request } from './client.ts';

/** Each location of the person's scope (or of the shop or region in `within`) over whole months (YYYY-MM), beside the network's medians. */
export const compareLocations = (from: string, to: string, within: ScopeParams = {}) =>
  request<LocationComparison>('/rollups/locations', { query: { from, to, ...within } });

export const getRollups = (query: RollupQuery) => request<Rollups>('/rollups', { query: { ...query } });
