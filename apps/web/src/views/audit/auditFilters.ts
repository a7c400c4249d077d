import dayjs from 'dayjs';
import type { LocationQuery } from 'vue-router';
import type { AuditFilter } from '../../api/admin.ts';
import { positiveInt } from '../../composables/usePagedList.ts';

/** The audit log's filters as the address bar holds them: days are the browser's own days. */
export interface AuditFilters {
  actorId?: number;
  /** The chosen person's name, kept beside the id so the picker can show it. */
  who?: string;
  entity?: string;
  buildNumber?: string;
  from?: string;
  to?: string;
}

/** Kinds of record the log can be narrowed to, in words. */
export const RECORD_KINDS: { value: string; label: string }[] = [
  { value: 'build', label: 'Builds' },
  { value: 'claim', label: 'Warranty claims' },
  { value: 'customer', label: 'Customers' },
  { value: 'vehicle', label: 'Vehicles' },
  { value: 'user', label: 'People and sign-ins' },
  { value: 'role_assignment', label: 'Roles' },
  { value: 'location', label: 'Shops' },
  { value: 'catalog_item', label: 'Catalog items' },
  { value: 'vendor', label: 'Vendors' },
  { value: 'plan', label: 'Power plans' },
  { value: 'export', label: 'Exports' },
];

const text = (value: unknown) => (typeof value === 'string' && value.trim() ? value.trim() : undefined);
const day = (value: unknown) => (typeof value === 'string' && /^\d{4}-\d{2}-\d{2}$/.test(value) ? value : undefined);

export function readAuditFilters(query: LocationQuery): AuditFilters {
  return {
    actorId: positiveInt(query.actorId),
    who: text(query.who),
    entity: text(query.entity),
    buildNumber: text(query.buildNumber)?.toUpperCase(),
    from: day(query.from),
    to: day(query.to),
  };
}

/** The request the API takes: a day range becomes the instants from the first day's start to the day after the last. */
export function auditRequest({ actorId, entity, buildNumber, from, to }: AuditFilters): AuditFilter {
  return {
    actorId,
    entity: buildNumber ? undefined : entity,
    buildNumber,
    from: from ? dayjs(from).startOf('day').toISOString() : undefined,
    to: to ? dayjs(to).add(1, 'day').startOf('day').toISOString() : undefined,
  };
}
