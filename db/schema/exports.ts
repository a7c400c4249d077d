import type { Generated } from 'kysely';

/** An export asked for and its job (migration 028); `locationIds` is a JSON array, null for the whole network. */
export interface ExportsTable {
  id: Generated<number>;
  kind: 'month-close';
  month: string;
  throughMonth: string;
  locationIds: string | null;
  scopeLabel: string;
  locationCount: number;
  format: 'xlsx' | 'csv';
  sheet: string | null;
  status: 'queued' | 'running' | 'done' | 'failed';
  rowsDone: Generated<number>;
  rowsTotal: number | null;
  error: string | null;
  fileName: string | null;
  fileBytes: number | null;
  checksum: string | null;
  createdBy: number;
  createdAt: string;
  finishedAt: string | null;
}
