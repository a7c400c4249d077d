import { z } from 'zod';
import { cursorQuery, pageQuery } from './common.ts';

export const auditQuery = z.strictObject({
  entity: z.string().trim().max(40).optional(),
  ...pageQuery,
  ...cursorQuery,
});

export interface AuditEntry {
  id: number;
  at: string;
  actorId: number | null;
  actorName: string | null;
  action: string;
  entity: string;
  entityId: number | null;
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
