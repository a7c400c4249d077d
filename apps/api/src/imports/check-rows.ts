import { isoDay, localDay } from '@busbar/calc';
import type { Db } from '@busbar/db';
import {
  IMPORT_COLUMNS,
  importRow,
  MAX_IMPORT_ROWS,
  parseItemsCell,
  REQUIRED_IMPORT_COLUMNS,
  type ImportItem,
  type ImportRow,
  type ImportRowResult,
} from '@busbar/shared';
import { fieldErrors } from '../errors.ts';
import { buildLeadsAt } from '../queries/assignments.ts';
import { parseCsv } from './csv.ts';

export interface CheckedRow {
  line: number;
  row: ImportRow;
  items: (ImportItem & { catalogItemId: number; unitPriceCents: number; unitCostCents: number })[];
  leadTechnicianId: number | null;
}

interface Catalog {
  bySku: Map<string, { id: number; serialized: number; unitPriceCents: number; unitCostCents: number }>;
}

const headerError = (errors: Record<string, string>): ImportRowResult[] => [{ line: 1, summary: 'Header', errors }];

/** Names that would reach into JavaScript's objects rather than name a column. */
const OBJECT_NAMES = new Set(['__proto__', 'constructor', 'prototype']);
/** An unknown column is named by itself only when it reads as a name; anything else by its place. */
const PLAIN_NAME = /^[a-z0-9_ -]{1,40}$/;

/**
 * Reads the header: every required column present, each once, no column Busbar does not know.
 * A column named like a part of JavaScript's objects (`__proto__`) is refused by its place.
 */
function readHeader(fields: string[]): { columns: string[]; errors: Record<string, string> } {
  const columns = fields.map((f) => f.trim().toLowerCase());
  const errors: Record<string, string> = {};
  const byPlace: string[] = [];
  columns.forEach((column, at) => {
    const place = `column ${at + 1}`;
    const first = columns.indexOf(column);
    if (column === '') byPlace.push(`The ${place} has no name`);
    else if (OBJECT_NAMES.has(column)) byPlace.push(`The ${place} is named "${column}", which is not a column of the import`);
    else if (!(IMPORT_COLUMNS as readonly string[]).includes(column)) {
      if (PLAIN_NAME.test(column)) errors[column] = 'Unknown column';
      else byPlace.push(`The ${place} is not a column of the import`);
    } else if (first !== at) errors[column] = `Named twice: columns ${first + 1} and ${at + 1}`;
  });
  for (const column of REQUIRED_IMPORT_COLUMNS) if (!columns.includes(column)) errors[column] = 'Missing column';
  if (byPlace.length > 0) errors._ = byPlace.join('; ');
  return { columns, errors };
}

/** Serials already installed, per SKU, among the ones the file names. */
async function installedSerials(db: Db, wanted: { sku: string; serialNumber: string }[]): Promise<Set<string>> {
  const found = new Set<string>();
  const serials = [...new Set(wanted.map((w) => w.serialNumber))];
  for (let i = 0; i < serials.length; i += 500) {
    const rows = await db.selectFrom('buildItems').select(['sku', 'serialNumber']).where('serialNumber', 'in', serials.slice(i, i + 500)).execute();
    for (const r of rows) found.add(`${r.sku}\u0000${r.serialNumber}`);
  }
  return found;
}

/**
 * Serial numbers are recorded once a unit is fitted, and a build is often cancelled before that:
 * a cancelled row's serialized units may come without them (`SKU` or `SKU x2`); any given are checked.
 */
function checkItems(cell: string, catalog: Catalog, cancelled: boolean, errors: Record<string, string>): CheckedRow['items'] {
  const parsed = parseItemsCell(cell);
  if (typeof parsed === 'string') {
    errors.items = parsed;
    return [];
  }
  const items: CheckedRow['items'] = [];
  for (const item of parsed) {
    const entry = catalog.bySku.get(item.sku);
    if (!entry) errors.items ??= `Unknown SKU ${item.sku}`;
    else if (entry.serialized && !cancelled && (!item.serialNumber || item.quantity !== 1)) errors.items ??= `${item.sku} needs one entry per unit: ${item.sku} #SERIAL`;
    else if (!entry.serialized && item.serialNumber) errors.items ??= `${item.sku} has no serial numbers`;
    else items.push({ ...item, catalogItemId: entry.id, unitPriceCents: entry.unitPriceCents, unitCostCents: entry.unitCostCents });
  }
  return items;
}

/**
 * Checks every row of an import against the schema, the catalog, the location's technicians and
 * the serial numbers already installed or repeated in the file. Nothing is written here.
 */
export async function checkImport(db: Db, location: { id: number; timeZone: string }, csv: string, at: string): Promise<{ results: ImportRowResult[]; rows: CheckedRow[] }> {
  let records: ReturnType<typeof parseCsv>;
  try {
    records = parseCsv(csv);
  } catch (error) {
    return { results: headerError({ _: (error as Error).message }), rows: [] };
  }
  const [header, ...body] = records;
  if (!header) return { results: headerError({ _: 'The file is empty' }), rows: [] };
  const { columns, errors: headerErrors } = readHeader(header.fields);
  if (Object.keys(headerErrors).length > 0) return { results: headerError(headerErrors), rows: [] };
  if (body.length > MAX_IMPORT_ROWS) return { results: headerError({ _: `At most ${MAX_IMPORT_ROWS} rows at a time` }), rows: [] };

  const catalogRows = await db.selectFrom('catalogItems').select(['id', 'sku', 'serialized', 'unitPriceCents', 'unitCostCents']).execute();
  const catalog: Catalog = { bySku: new Map(catalogRows.map((c) => [c.sku, c])) };
  const leads = await db
    .selectFrom('users')
    .select(['id', 'email'])
    .where('id', 'in', [0, ...(await buildLeadsAt(db, location.id)).map((p) => p.id)])
    .execute();
  const today = isoDay(localDay(location.timeZone, Date.parse(at)));
  const results: ImportRowResult[] = [];
  const rows: CheckedRow[] = [];
  for (const record of body) {
    const cells = Object.fromEntries(IMPORT_COLUMNS.map((c) => [c, record.fields[columns.indexOf(c)]?.trim() ?? '']));
    const parsed = importRow.safeParse(cells);
    const errors: Record<string, string> = parsed.success ? {} : fieldErrors(parsed.error);
    if (parsed.success) checkPast(parsed.data, today, errors);
    const items = checkItems(cells.items ?? '', catalog, cells.status?.toLowerCase() === 'cancelled', errors);
    const lead = cells.lead_technician_email ? leads.find((p) => p.email === cells.lead_technician_email!.toLowerCase()) : undefined;
    if (cells.lead_technician_email && !lead) errors.lead_technician_email ??= 'Not a technician or lead of this location';
    results.push({ line: record.line, summary: parsed.success ? summarize(parsed.data, items.length) : '', errors });
    if (parsed.success) rows.push({ line: record.line, row: parsed.data, items, leadTechnicianId: lead?.id ?? null });
  }
  await checkSerials(db, rows, results);
  return { results, rows };
}

/** Imports bring in past builds: a date after the shop's today is a typing slip or a build to book in Busbar. */
function checkPast(row: ImportRow, today: string, errors: Record<string, string>) {
  if (row.delivered_on > today) errors.delivered_on ??= `This date is after today (${today}): import only builds already delivered`;
  if (row.booked_for > today) errors.booked_for ??= `This date is after today (${today}): book a build still to come in Busbar itself`;
}

/** A serial number may be installed once per SKU: not already in Busbar, not twice in the file. */
async function checkSerials(db: Db, rows: CheckedRow[], results: ImportRowResult[]) {
  const wanted = rows.flatMap((r) => r.items.filter((i) => i.serialNumber).map((i) => ({ sku: i.sku, serialNumber: i.serialNumber!, line: r.line })));
  const installed = await installedSerials(db, wanted);
  const seen = new Map<string, number>();
  const byLine = new Map(results.map((r) => [r.line, r]));
  for (const w of wanted) {
    const key = `${w.sku}\u0000${w.serialNumber}`;
    const errors = byLine.get(w.line)!.errors;
    if (installed.has(key)) errors.items ??= `Serial number ${w.serialNumber} of ${w.sku} is already recorded in Busbar`;
    else if (seen.has(key)) errors.items ??= `Serial number ${w.serialNumber} of ${w.sku} is also on line ${seen.get(key)}`;
    else seen.set(key, w.line);
  }
}

function summarize(row: ImportRow, itemCount: number): string {
  const status = row.status === 'delivered' ? `Delivered ${row.delivered_on}` : 'Cancelled';
  const vehicle = `${row.vehicle_year} ${row.vehicle_make} ${row.vehicle_model}${row.vehicle_vin ? ` (VIN ${row.vehicle_vin})` : ''}`;
  return `${status}: ${row.customer_name}, ${vehicle}, ${itemCount} component line${itemCount === 1 ? '' : 's'}, ${row.labor_hours} h labor`;
}
