import type { Generated } from 'kysely';

export interface AuditLogTable {
  id: Generated<number>;
  at: string;
  actorId: number | null;
  action: string;
  entity: string;
  entityId: number | null;
  /** JSON of the record before and after the change (null where there was none). */
  before: string | null;
  after: string | null;
}
