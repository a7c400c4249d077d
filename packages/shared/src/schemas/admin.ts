import { z } from 'zod';
import { cursorQuery, idSchema, optionalText, pageQuery } from './common.ts';

/** A time the audit log is filtered by: an ISO-8601 instant with its offset, or a day (its UTC midnight). */
const auditTime = z.union([z.iso.date(), z.iso.datetime({ offset: true })], { error: 'Use a date like 2026-06-15 or a time like 2026-06-15T06:00:00Z' });

/**
 * The audit log's filters: who acted, the kind of record and one record of it (or a build by its
 * number), and a time range (`from` inclusive, `to` exclusive); newest first.
 */
export const auditQuery = z
  .strictObject({
    actorId: idSchema.optional(),
    entity: optionalText(40).optional(),
    entityId: idSchema.optional(),
    buildNumber: z.string().trim().toUpperCase().regex(/^[A-Z0-9]{1,12}-\d{1,9}$/, 'Use a build number like DEN-00012').optional(),
    from: auditTime.optional(),
    to: auditTime.optional(),
    ...pageQuery,
    ...cursorQuery,
  })
  .refine((q) => q.entityId === undefined || q.entity, { error: 'Choose the kind of record too', path: ['entity'] })
  .refine((q) => q.buildNumber === undefined || q.entity === undefined || q.entity === 'build', { error: 'A build number finds builds only', path: ['entity'] });
export type AuditQuery = z.infer<typeof auditQuery>;

export interface AuditEntry {
  id: number;
  at: string;
  actorId: number | null;
  actorName: string | null;
  action: string;
  entity: string;
  entityId: number | null;
  /** What happened, in one sentence of words. */
  summary: string;
  /** The record by its number or name ("Build DEN-00012"). */
  record: string;
  /** Each changed value in words. */
  details: string[];
  /** The person's reason for a correction after delivery. */
  reason: string | null;
  before: unknown;
  after: unknown;
}

export const outboxQuery = z.strictObject({ ...pageQuery, ...cursorQuery });

export interface MailEntry {
  id: number;
  sentAt: string;
  to: string;
  subject: string;
  text: string;
  status: 'sent' | 'failed';
  error: string | null;
}

export interface RegionView {
  id: number;
  code: string;
  name: string;
}

export interface LocationView {
  id: number;
  regionId: number;
  code: string;
  name: string;
  timeZone: string;
}

export interface HealthView {
  status: 'ok' | 'degraded';
  database: 'ok' | 'unavailable';
  version: string;
}
