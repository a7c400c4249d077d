import type {
  BuildCreate,
  BuildDetail,
  BuildHistory,
  BuildStatus,
  BuildUpdate,
  BuildView,
  ImportResult,
  Page,
  SerialMatch,
} from '@busbar/shared';
import { request } from './client.ts';

export type BuildSort = 'number' | 'bookedFor' | 'deliveredOn' | 'status' | 'totalCents' | 'updatedAt';

export interface BuildFilter {
  status?: BuildStatus[];
  locationId?: number;
  regionId?: number;
  technicianId?: number;
  from?: string;
  to?: string;
  deliveredFrom?: string;
  deliveredTo?: string;
  q?: string;
  hasPlan?: 'true' | 'false';
  sort?: BuildSort;
  order?: 'asc' | 'desc';
  page?: number;
  pageSize?: number;
}

export interface StatusChange {
  version: number;
  to: BuildStatus;
  note: string;
}

export interface ItemAdd {
  version: number;
  catalogItemId: number;
  quantity: number;
  serialNumber: string | null;
  /** Why, when the build is delivered (required then). */
  correctionNote?: string;
}

export interface ItemUpdate {
  version: number;
  quantity?: number;
  serialNumber?: string | null;
  correctionNote?: string;
}

export interface ImportRequest {
  locationId: number;
  csv: string;
  dryRun: boolean;
}

export const listBuilds = (filter: BuildFilter) => request<Page<BuildView>>('/builds', { query: { ...filter } });

export const getBuild = (id: number) => request<BuildDetail>(`/builds/${id}`);

export const createBuild = (body: BuildCreate) => request<BuildDetail>('/builds', { method: 'POST', body });

export const updateBuild = (id: number, body: BuildUpdate) =>
  request<BuildDetail>(`/builds/${id}`, { method: 'PATCH', body });

export const changeBuildStatus = (id: number, body: StatusChange) =>
  request<BuildDetail>(`/builds/${id}/status`, { method: 'POST', body });

export const addBuildItem = (id: number, body: ItemAdd) =>
  request<BuildDetail>(`/builds/${id}/items`, { method: 'POST', body });

export const updateBuildItem = (id: number, itemId: number, body: ItemUpdate) =>
  request<BuildDetail>(`/builds/${id}/items/${itemId}`, { method: 'PATCH', body });

/** Removes a line; a delivered build's removal carries the reason. */
export const removeBuildItem = (id: number, itemId: number, version: number, correctionNote?: string) =>
  request<BuildDetail>(`/builds/${id}/items/${itemId}`, { method: 'DELETE', query: { version }, ...(correctionNote ? { body: { correctionNote } } : {}) });

/** The build's history in words, newest first. */
export const getBuildHistory = (id: number) => request<BuildHistory>(`/builds/${id}/history`);

/** The first page of units whose serial number starts with `q`. */
export const findSerials = (q: string) => request<Page<SerialMatch>>('/serials', { query: { q } });

export const importBuilds = (body: ImportRequest) =>
  request<ImportResult>('/imports/builds', { method: 'POST', body });
