import { z } from 'zod';
import { cursorQuery, idSchema, multilineText, optionalText, pageQuery, pagingOf, text } from './common.ts';
import type { Category } from './catalog.ts';

export const BUILD_STATUSES = ['draft', 'quoted', 'booked', 'in_bay', 'quality_check', 'delivered', 'cancelled'] as const;
export type BuildStatus = (typeof BUILD_STATUSES)[number];

export const BUILD_STATUS_LABELS: Record<BuildStatus, string> = {
  draft: 'Draft',
  quoted: 'Quoted',
  booked: 'Booked',
  in_bay: 'In the bay',
  quality_check: 'Final check',
  delivered: 'Delivered',
  cancelled: 'Cancelled',
};

/**
 * The allowed status changes and the action each needs on the build: `plan` (the location lead:
 * quoting, booking, cancelling) or `update` (also the build's lead technician: the work in the bay).
 */
export const BUILD_TRANSITIONS: readonly { from: BuildStatus; to: BuildStatus; action: 'plan' | 'update' }[] = [
  { from: 'draft', to: 'quoted', action: 'plan' },
  { from: 'quoted', to: 'draft', action: 'plan' },
  { from: 'quoted', to: 'booked', action: 'plan' },
  { from: 'booked', to: 'quoted', action: 'plan' },
  { from: 'booked', to: 'in_bay', action: 'update' },
  { from: 'in_bay', to: 'quality_check', action: 'update' },
  { from: 'quality_check', to: 'in_bay', action: 'update' },
  { from: 'quality_check', to: 'delivered', action: 'update' },
  ...(['draft', 'quoted', 'booked', 'in_bay', 'quality_check'] as const).map((from) => ({
    from,
    to: 'cancelled' as const,
    action: 'plan' as const,
  })),
];

/** Statuses in which a serialized unit may wait for its serial number: planned, or being fitted. */
export const SERIAL_MAY_WAIT: readonly BuildStatus[] = ['draft', 'quoted', 'booked', 'in_bay'];

/** The transition from one status to another, if the workflow allows it at all. */
export function findTransition(from: BuildStatus, to: BuildStatus) {
  return BUILD_TRANSITIONS.find((t) => t.from === from && t.to === to);
}

const isoDate = z.iso.date('Use a date like 2026-03-31');
/** Labor hours of a build, as the build form and the import take them. */
export const laborHoursSchema = z.number('Enter hours').min(0, 'Cannot be negative').max(1000, 'At most 1000 hours');
const laborHours = laborHoursSchema;
/** A build's notes, as the build form and the import take them (several lines). */
export const buildNotesSchema = multilineText(4000);
const notes = buildNotesSchema.default('');

export const buildCreate = z.strictObject({
  locationId: z.int().positive({ error: 'Choose a location' }),
  customerId: z.int().positive({ error: 'Choose a customer' }),
  vehicleId: z.int().positive({ error: 'Choose a vehicle' }),
  leadTechnicianId: z.int().positive().nullable().default(null),
  bookedFor: isoDate.nullable().default(null),
  laborHours: laborHours.default(0),
  notes,
});
export type BuildCreate = z.infer<typeof buildCreate>;

/** Why a delivered build is changed: required after delivery (the API refuses without it), kept in its history and audit. */
const correctionReason = multilineText(1000).optional();

/** An edit carries the version it was made against; a delivered build also needs a correction note. */
export const buildUpdate = z.strictObject({
  version: z.int().min(1),
  customerId: z.int().positive().optional(),
  vehicleId: z.int().positive().optional(),
  leadTechnicianId: z.int().positive().nullable().optional(),
  bookedFor: isoDate.nullable().optional(),
  laborHours: laborHours.optional(),
  notes: buildNotesSchema.optional(),
  correctionNote: correctionReason,
});
export type BuildUpdate = z.infer<typeof buildUpdate>;

export const buildStatusChange = z.strictObject({
  version: z.int().min(1),
  to: z.enum(BUILD_STATUSES, { error: 'Choose a status' }),
  note: multilineText(1000).default(''),
});

/** A serial number as recorded on a build line. */
export const serialNumberSchema = text(60, 'Enter the serial number').regex(/^[A-Za-z0-9][A-Za-z0-9./_-]*$/, 'Letters, digits and . / _ - only');

export const buildItemAdd = z.strictObject({
  version: z.int().min(1),
  catalogItemId: z.int().positive({ error: 'Choose a component' }),
  quantity: z.int('Whole units').min(1, 'At least 1').max(999),
  serialNumber: serialNumberSchema.nullable().default(null),
  correctionNote: correctionReason,
});
export const buildItemUpdate = z.strictObject({
  version: z.int().min(1),
  quantity: z.int('Whole units').min(1, 'At least 1').max(999).optional(),
  serialNumber: serialNumberSchema.nullable().optional(),
  correctionNote: correctionReason,
});
/** A line's removal: its version goes in the query, the reason (a delivered build's) in the body. */
export const buildItemRemove = z.strictObject({ correctionNote: correctionReason });
export const buildItemParams = z.strictObject({ id: idSchema, itemId: idSchema });
export const versionQuery = z.strictObject({ version: z.coerce.number().int().min(1) });

export const BUILD_SORTS = ['number', 'bookedFor', 'deliveredOn', 'status', 'totalCents', 'updatedAt'] as const;
/** A list of builds by the day each was delivered at its shop is a list of deliveries: it needs their span of days. */
const deliveredOnNeedsDays = (q: { sort: string; deliveredFrom?: string; deliveredTo?: string }) =>
  q.sort !== 'deliveredOn' || Boolean(q.deliveredFrom || q.deliveredTo);
export const buildQuery = z
  .strictObject({
    status: z.union([z.enum(BUILD_STATUSES), z.array(z.enum(BUILD_STATUSES))]).optional(),
    locationId: idSchema.optional(),
    /** The shops of one region (the scope chosen in the header); with `locationId`, both must hold. */
    regionId: idSchema.optional(),
    technicianId: idSchema.optional(),
    /** Booked for a day from and to (inclusive). */
    from: isoDate.optional(),
    to: isoDate.optional(),
    /** Delivered on a day at its location from and to (inclusive). */
    deliveredFrom: isoDate.optional(),
    deliveredTo: isoDate.optional(),
    q: optionalText(100).optional(),
    /** Only builds with (true) or without (false) a power plan. */
    hasPlan: z.enum(['true', 'false']).optional(),
    sort: z.enum(BUILD_SORTS).default('updatedAt'),
    order: z.enum(['asc', 'desc']).default('desc'),
    ...pageQuery,
    ...cursorQuery,
  })
  .refine(deliveredOnNeedsDays, { path: ['sort'], message: 'Sort by delivery day once the list is narrowed to days of delivery', when: (p) => p.issues.length === 0 });
export type BuildQuery = z.infer<typeof buildQuery>;

export interface BuildItemView {
  id: number;
  catalogItemId: number;
  sku: string;
  name: string;
  category: Category;
  quantity: number;
  /** Whether each unit carries a serial number (from the catalog item). */
  serialized: boolean;
  serialNumber: string | null;
  /** The day the unit was taken out under a warranty claim; null while in service. */
  removedOn: string | null;
  unitPriceCents?: number;
  unitCostCents?: number;
}

export interface BuildEventView {
  id: number;
  at: string;
  actorName: string | null;
  kind: 'status' | 'correction';
  fromStatus: BuildStatus | null;
  toStatus: BuildStatus | null;
  note: string;
}

/** One change of a build in words, as its history shows it. */
export interface BuildHistoryEntry {
  key: string;
  at: string;
  actorName: string | null;
  /** A move along the workflow, a change before delivery, or a correction after it (with its reason). */
  kind: 'status' | 'change' | 'correction';
  summary: string;
  details: string[];
  reason: string | null;
}

/** A build's history, newest first: at most `BUILD_HISTORY_CAP` entries, `more` when older ones exist. */
export interface BuildHistory {
  number: string;
  entries: BuildHistoryEntry[];
  more: boolean;
}

export const BUILD_HISTORY_CAP = 200;

/** A build as read; money fields are absent for people who may not read them. */
export interface BuildView {
  id: number;
  number: string;
  locationId: number;
  locationCode: string;
  customerId: number;
  customerName: string;
  vehicleId: number;
  vehicleLabel: string;
  vehicleVin: string | null;
  vehiclePlate: string | null;
  status: BuildStatus;
  leadTechnicianId: number | null;
  leadTechnicianName: string | null;
  bookedFor: string | null;
  startedAt: string | null;
  deliveredAt: string | null;
  /** The day of `deliveredAt` at the build's shop. */
  deliveredOn: string | null;
  laborHours: number;
  laborRateCents?: number;
  laborCents?: number;
  partsPriceCents?: number;
  partsCostCents?: number;
  marginCents?: number;
  totalCents?: number;
  notes: string;
  version: number;
  createdAt: string;
  updatedAt: string;
  /** Lines of serial-numbered parts still without a serial number. */
  serialsToRecord: number;
}

export interface BuildDetail extends BuildView {
  items: BuildItemView[];
  events: BuildEventView[];
}

export const serialQuery = z.strictObject({ q: optionalText(60).min(3, 'Enter at least 3 characters'), ...pagingOf(100) });

/** One installed unit found by its serial number. */
export interface SerialMatch {
  serialNumber: string;
  sku: string;
  name: string;
  buildId: number;
  buildNumber: string;
  locationCode: string;
  status: BuildStatus;
  deliveredAt: string | null;
}
