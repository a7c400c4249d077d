import { BUILD_STATUS_LABELS, CLAIM_STATUS_LABELS, COST_FIELDS, PRICE_FIELDS, ROLE_LABELS, type BuildStatus, type ClaimStatus, type Role } from '@busbar/shared';
import type { AuditNames, NameKind } from './audit-names.ts';

/** What the reader may be shown of a row's stored values. */
export interface WordsOptions {
  /** Prices and costs: left out where the reader's role does not read them. */
  money: boolean;
}

/** Fields that say nothing to a reader (bookkeeping) or are said elsewhere (the reason, the note). */
const SKIPPED = new Set(['id', 'version', 'reason', 'note', 'sequence', 'createdAt', 'updatedAt', 'createdBy', 'updatedBy', 'input', 'line']);
/** Free text: said to have changed, not repeated in full. */
const LONG_TEXT = new Set(['notes', 'symptom', 'description', 'text']);
const MONEY = new Set<string>([...PRICE_FIELDS, ...COST_FIELDS]);
const LABELS: Record<string, string> = {
  laborHours: 'Labor',
  leadTechnicianId: 'Lead technician',
  bookedFor: 'Booked for',
  customerId: 'Customer',
  vehicleId: 'Vehicle',
  locationId: 'Shop',
  regionId: 'Region',
  userId: 'Person',
  vendorId: 'Vendor',
  catalogItemId: 'Component',
  buildId: 'Build',
  sku: 'SKU',
  serialNumber: 'Serial number',
  claimApprovalLimitCents: 'Claim approval limit',
};
const ID_KINDS: Record<string, NameKind> = {
  leadTechnicianId: 'users',
  customerId: 'customers',
  vehicleId: 'vehicles',
  locationId: 'locations',
  regionId: 'regions',
  userId: 'users',
  vendorId: 'vendors',
  catalogItemId: 'catalog',
  buildId: 'builds',
};
const SOMEONE: Record<NameKind, string> = {
  builds: 'a build',
  claims: 'a warranty claim',
  customers: 'a customer',
  vehicles: 'a vehicle',
  users: 'a person',
  locations: 'a shop',
  regions: 'a region',
  vendors: 'a vendor',
  catalog: 'a component',
  skus: 'a component',
  plans: 'a power plan',
};

/** The name of a record, or "a build", "a person" where it is unknown or not the reader's to see. */
export function nameOf(names: AuditNames, kind: NameKind, id: unknown): string {
  const name = names[kind].get(id as never);
  return name ?? SOMEONE[kind];
}

/** A field's name in words: `laborHours` → "Labor", `unitPriceCents` → "Unit price". */
export function fieldLabel(field: string): string {
  if (LABELS[field]) return LABELS[field];
  const words = field.replace(/(Cents|Id|On|At)$/, (end) => (end === 'On' || end === 'At' ? ` ${end.toLowerCase()}` : '')).replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

const money = (cents: number) => (cents / 100).toLocaleString('en-US', { style: 'currency', currency: 'USD' });

/** One stored value in words. */
export function valueWords(field: string, value: unknown, names: AuditNames): string {
  if (value === null || value === undefined || value === '') return 'none';
  if (ID_KINDS[field]) return nameOf(names, ID_KINDS[field], value);
  if (field === 'laborHours' && typeof value === 'number') return `${value} h`;
  if (field.endsWith('Cents') && typeof value === 'number') return money(value);
  if (field === 'status' && typeof value === 'string') return BUILD_STATUS_LABELS[value as BuildStatus] ?? CLAIM_STATUS_LABELS[value as ClaimStatus] ?? value;
  if (field === 'role' && typeof value === 'string') return ROLE_LABELS[value as Role] ?? value;
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'object') return Array.isArray(value) ? `${value.length} ${value.length === 1 ? 'entry' : 'entries'}` : 'changed';
  return String(value);
}

/**
 * Each field the change set, or moved from one value to another, in words ("Labor: 3.5 h → 4 h").
 * Money is left out unless the reader reads it; long text is said to have changed.
 */
export function fieldChanges(before: unknown, after: unknown, names: AuditNames, options: WordsOptions): string[] {
  const from = (before && typeof before === 'object' ? before : {}) as Record<string, unknown>;
  const to = (after && typeof after === 'object' ? after : {}) as Record<string, unknown>;
  const fields = [...new Set([...Object.keys(from), ...Object.keys(to)])];
  const lines: string[] = [];
  for (const field of fields) {
    if (SKIPPED.has(field) || (MONEY.has(field) && !options.money)) continue;
    const was = from[field];
    const now = to[field];
    if (JSON.stringify(was) === JSON.stringify(now) || (!(field in from) && (now === null || now === ''))) continue;
    const label = fieldLabel(field);
    if (LONG_TEXT.has(field)) lines.push(`${label} ${field in from ? 'changed' : 'written'}`);
    else if (!(field in from)) lines.push(`${label}: ${valueWords(field, now, names)}`);
    else if (!(field in to)) lines.push(`${label} was ${valueWords(field, was, names)}`);
    else lines.push(`${label}: ${valueWords(field, was, names)} → ${valueWords(field, now, names)}`);
  }
  return lines;
}
