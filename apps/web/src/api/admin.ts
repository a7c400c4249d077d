import type { AuditEntry, HealthView, LocationView, MailEntry, Page, RegionView } from '@busbar/shared';
import { request } from './client.ts';

interface PageRequest {
  page?: number;
  pageSize?: number;
}

export const getHealth = () => request<HealthView>('/health');

export const listRegions = () => request<RegionView[]>('/regions');

export const listLocations = () => request<LocationView[]>('/locations');

/** The audit log's filters (see `auditQuery`): who, which kind of record or build, between two times. */
export interface AuditFilter {
  actorId?: number;
  entity?: string;
  buildNumber?: string;
  from?: string;
  to?: string;
}

export const listAudit = (query: PageRequest & AuditFilter) => request<Page<AuditEntry>>('/audit', { query: { ...query } });

export const listOutbox = (query: PageRequest) => request<Page<MailEntry>>('/outbox', { query: { ...query } });

/** People who may lead a build at a location. */
export interface TechnicianOption {
  id: number;
  name: string;
}

export const listTechnicians = (locationId: number) =>
  request<TechnicianOption[]>(`/locations/${locationId}/technicians`);

/** A page of the people who may lead builds at the person's shops (within one shop or region), by a part of their name, or one of them by id. */
export const findBuildLeads = (query: PageRequest & { q?: string; id?: number; locationId?: number; regionId?: number }) =>
  request<Page<TechnicianOption>>('/locations/technicians', { query: { ...query } });
