import { z } from 'zod';
import { buildNotesSchema, laborHoursSchema, serialNumberSchema } from './builds.ts';
import { skuSchema } from './catalog.ts';
import { emailSchema, optionalText } from './common.ts';
import { customerFields, vehicleFields } from './customers.ts';
import { plateSchema, vinSchema } from './vehicle-identity.ts';

/** The columns of a historical build import, in the order the template lists them. */
export const IMPORT_COLUMNS = [
  'customer_name',
  'customer_email',
  'customer_phone',
  'vehicle_year',
  'vehicle_body_style',
  'vehicle_make',
  'vehicle_model',
  'vehicle_vin',
  'vehicle_plate',
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

/** Said of a file that is not UTF-8 text, naming the line of the first character that cannot be read. */
export const notUtf8 = (line: number) =>
  `This file is not UTF-8 text (the first character that cannot be read is on line ${line}): save it as CSV UTF-8 from your spreadsheet and try again`;

/**
 * The line of the first character a UTF-8 reader could not read (U+FFFD, which browsers and the
 * API's JSON reader put in place of bytes that are not UTF-8), or null when there is none.
 */
export function unreadableLine(text: string): number | null {
  const at = text.indexOf('\uFFFD');
  if (at < 0) return null;
  let line = 1;
  for (let i = text.indexOf('\n'); i >= 0 && i < at; i = text.indexOf('\n', i + 1)) line++;
  return line;
}

export const importBuildsBody = z.strictObject({
  locationId: z.int().positive({ error: 'Choose a location' }),
  csv: z
    .string()
    .min(1, 'Paste or choose a CSV file')
    .max(5_000_000, 'At most 5 MB')
    .superRefine((csv, ctx) => {
      const line = unreadableLine(csv);
      if (line !== null) ctx.addIssue({ code: 'custom', message: notUtf8(line) });
    }),
  dryRun: z.boolean(),
});

const blank = z.literal('');
const isoDate = z.iso.date('Use a date like 2025-03-31');

/** A number as typed in a cell: decimal digits only (no `0x7E3` or `2e3` for 2019), blank as missing. */
const decimal = (cell: string) => (cell === '' ? undefined : /^-?\d+(\.\d+)?$/.test(cell) ? Number(cell) : Number.NaN);

/**
 * One CSV row, all cells as text; blank cells take their defaults. Each value is checked by the
 * rule of the form that takes it (customer, vehicle and build forms), so the two cannot disagree.
 */
export const importRow = z
  .object({
    customer_name: customerFields.name,
    customer_email: customerFields.email,
    customer_phone: customerFields.phone,
    vehicle_year: z.string().trim().transform(decimal).pipe(vehicleFields.year),
    vehicle_body_style: z.string().trim().toLowerCase().transform((s) => s.replaceAll(' ', '_')).pipe(vehicleFields.bodyStyle),
    vehicle_make: vehicleFields.make,
    vehicle_model: vehicleFields.model,
    vehicle_vin: vinSchema,
    vehicle_plate: plateSchema,
    status: z.string().trim().toLowerCase().transform((s) => s || 'delivered').pipe(z.enum(['delivered', 'cancelled'], { error: 'Use delivered or cancelled' })),
    booked_for: z.union([blank, isoDate]),
    delivered_on: z.union([blank, isoDate]),
    lead_technician_email: z.union([blank, emailSchema]),
    labor_hours: z.string().trim().transform((s) => (s === '' ? 0 : decimal(s))).pipe(laborHoursSchema),
    items: optionalText(2000),
    notes: buildNotesSchema,
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
    const match = /^(\S+)(?:\s+x\s*(\d{1,3})|\s+#(\S+))?$/i.exec(entry);
    if (!match) return `"${entry}" is not SKU, SKU x2 or SKU #SERIAL`;
    const sku = skuSchema.safeParse(match[1]);
    if (!sku.success) return `The SKU in "${entry}": ${sku.error.issues[0]!.message}`;
    const serial = match[3] === undefined ? null : serialNumberSchema.safeParse(match[3]);
    if (serial && !serial.success) return `The serial number in "${entry}": ${serial.error.issues[0]!.message}`;
    const quantity = match[2] ? Number(match[2]) : 1;
    if (quantity < 1) return `"${entry}" needs a quantity of at least 1`;
    items.push({ sku: sku.data, quantity, serialNumber: serial ? serial.data : null });
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

