import { z } from 'zod';
import { idSchema, pageQuery } from './common.ts';
import { monthSchema, monthsBetween } from './rollups.ts';

/** The sheets of a month-close workbook, in order; a CSV export is one of them. */
export const EXPORT_SHEETS = ['summary', 'builds', 'lines', 'claims', 'royalty'] as const;
export type ExportSheet = (typeof EXPORT_SHEETS)[number];
export const EXPORT_SHEET_NAMES: Record<ExportSheet, string> = {
  summary: 'Summary',
  builds: 'Delivered builds',
  lines: 'Build lines',
  claims: 'Warranty claims',
  royalty: 'Royalty statements',
};

/** The most months one export covers. */
export const MAX_EXPORT_MONTHS = 12;

/**
 * An export to make: the month close of `month` (through `throughMonth`, inclusive, when given) at
 * the person's locations, or at the ones listed, or in one region of them; a workbook of every
 * sheet, or one sheet as CSV (the summary unless `sheet` says).
 */
export const exportBody = z
  .strictObject({
    kind: z.literal('month-close', { error: 'Busbar exports the month close' }),
    month: monthSchema,
    throughMonth: monthSchema.optional(),
    locationIds: z.array(idSchema).min(1, 'Pick at least one shop').max(1000, 'Pick at most 1,000 shops').optional(),
    regionId: idSchema.optional(),
    format: z.enum(['xlsx', 'csv'], { error: 'Pick a workbook (xlsx) or CSV' }).default('xlsx'),
    sheet: z.enum(EXPORT_SHEETS, { error: 'Pick one of the sheets' }).optional(),
  })
  .refine((b) => !b.throughMonth || b.throughMonth >= b.month, { path: ['throughMonth'], message: 'Pick a last month on or after the first' })
  .refine((b) => !b.throughMonth || b.throughMonth < b.month || monthsBetween(b.month, b.throughMonth) <= MAX_EXPORT_MONTHS, {
    path: ['throughMonth'],
    message: `An export covers at most ${MAX_EXPORT_MONTHS} months`,
  })
  .refine((b) => !(b.locationIds && b.regionId), { path: ['regionId'], message: 'Pick shops or a region, not both' })
  .refine((b) => b.format === 'csv' || !b.sheet, { path: ['sheet'], message: 'A workbook holds every sheet; pick a sheet only for CSV' });
export type ExportBody = z.input<typeof exportBody>;

export const exportListQuery = z.strictObject({ ...pageQuery });

export type ExportStatus = 'queued' | 'running' | 'done' | 'failed';

/** An export as its history keeps it: who asked for what, how far it got, and the file it made. */
export interface ExportJob {
  id: number;
  kind: 'month-close';
  month: string;
  throughMonth: string;
  /** The shops it covers, in words ("Whole network", "Pacific region", "3 shops: SEA, POR, BOI"). */
  scopeLabel: string;
  locationCount: number;
  format: 'xlsx' | 'csv';
  sheet: ExportSheet | null;
  status: ExportStatus;
  rowsDone: number;
  /** Every row it writes, known once it has started. */
  rowsTotal: number | null;
  /** Why it failed, in words. */
  error: string | null;
  fileName: string | null;
  fileBytes: number | null;
  /** SHA-256 of the file, hex. */
  checksum: string | null;
  createdById: number;
  createdByName: string;
  createdAt: string;
  finishedAt: string | null;
}
