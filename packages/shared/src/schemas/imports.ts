import { z } from 'zod';
import { BODY_STYLES } from './customers.ts';
import { emailSchema, personNameSchema } from './common.ts';

/** The columns of a historical build import, in the order the template lists them. */
export const IMPORT_COLUMNS = [
  'customer_name',
  'customer_email',
  'customer_phone',
  'vehicle_year',
  'vehicle_body_style',
  'vehicle_make',
  'vehicle_model',
  'status',
  'booked_for',
  'delivered_on',
  'lead_technician_email',
  'labor_hours',
  'items',
  'notes',
] as const;
export const REQUIRED_IMPORT_COLUMNS = ['customer_name', 'vehicle_year', 'vehicle_body_style', 'vehicle_make', 'vehicle_model', 'items'] as const;
export const MAX_IMPORT_ROWS = 5000;

export const importBuildsBody = z.strictObject({
  locationId: z.int().positive({ error: 'Choose a location' }),
  csv: z.string().min(1, 'Paste or choose a CSV file').max(5_000_000, 'At most 5 MB'),
  dryRun: z.boolean(),
});

const blank = z.literal('');
const isoDate = z.iso.date('Use a date like 2025-03-31');
const text = (max: number) => z.string().trim().max(max, `At most ${max} characters`);

/** One CSV row, all cells as text; blank cells take their defaults. */
export const importRow = z
  .object({
    customer_name: personNameSchema,
    customer_email: z.union([blank, emailSchema]),
    customer_phone: text(40),
    vehicle_year: z.coerce.number('Enter a year').int('Enter a year').min(1950, 'From 1950').max(2100, 'Until 2100'),
    vehicle_body_style: z.string().trim().toLowerCase().transform((s) => s.replaceAll(' ', '_')).pipe(z.enum(BODY_STYLES, { error: `One of ${BODY_STYLES.join(', ')}` })),
    vehicle_make: text(60).min(1, 'Enter the make'),
    vehicle_model: text(80).min(1, 'Enter the model'),
    status: z.string().trim().toLowerCase().transform((s) => s || 'delivered').pipe(z.enum(['delivered', 'cancelled'], { error: 'delivered or cancelled' })),
    booked_for: z.union([blank, isoDate]),
    delivered_on: z.union([blank, isoDate]),
    lead_technician_email: z.union([blank, emailSchema]),
    labor_hours: z.string().trim().transform((s) => (s === '' ? 0 : Number(s))).pipe(z.number('Enter hours').min(0, 'Cannot be negative').max(1000, 'At most 1000 hours')),
    items: text(2000),
    notes: text(4000),
  })
  .superRefine((row, ctx) => {
    if (row.status === 'delivered' && !row.delivered_on) ctx.addIssue({ code: 'custom', path: ['delivered_on'], message: 'A delivered build needs its delivery date' });
    if (row.status === 'cancelled' && row.delivered_on) ctx.addIssue({ code: 'custom', path: ['delivered_on'], message: 'A cancelled build has no delivery date' });
    if (row.booked_for && row.delivered_on && row.delivered_on < row.booked_for) {
      ctx.addIssue({ code: 'custom', path: ['delivered_on'], message: 'Delivered before it was booked' });
    }
  });
export type ImportRow = z.infer<typeof importRow>;

export interface ImportItem {
  sku: string;
  quantity: number;
  serialNumber: string | null;
}

/** Reads the items cell: entries separated by ";", each `SKU`, `SKU x2` or `SKU #SERIAL`. */
export function parseItemsCell(cell: string): ImportItem[] | string {
  const items: ImportItem[] = [];
  for (const entry of cell.split(';').map((e) => e.trim()).filter(Boolean)) {
    const match = /^([A-Za-z0-9][A-Za-z0-9._-]*)(?:\s+x\s*(\d{1,3})|\s+#([A-Za-z0-9][A-Za-z0-9./_-]*))?$/i.exec(entry);
    if (!match) return `"${entry}" is not SKU, SKU x2 or SKU #SERIAL`;
    const quantity = match[2] ? Number(match[2]) : 1;
    if (quantity < 1) return `"${entry}" needs a quantity of at least 1`;
    items.push({ sku: match[1]!, quantity, serialNumber: match[3] ?? null });
  }
  return items;
}

export interface ImportRowResult {
  line: number;
  /** What the row would create, in words, when it can be read. */
  summary: string;
  errors: Record<string, string>;
}

export interface ImportResult {
  ok: boolean;
  created: number;
  rows: ImportRowResult[];
}
