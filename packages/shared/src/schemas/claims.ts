import { z } from 'zod';
import { serialNumberSchema } from './builds.ts';
import { CATEGORIES } from './catalog.ts';
import { idSchema, multilineText, optionalText, pagingOf } from './common.ts';

/** Where a warranty claim stands, in order (DESIGN.md). */
export const CLAIM_STATUSES = ['logged', 'evidence_ready', 'sent_to_vendor', 'approved', 'denied', 'credited', 'closed'] as const;
export type ClaimStatus = (typeof CLAIM_STATUSES)[number];

export const CLAIM_STATUS_LABELS: Record<ClaimStatus, string> = {
  logged: 'Logged',
  evidence_ready: 'Evidence ready',
  sent_to_vendor: 'Sent to vendor',
  approved: 'Approved',
  denied: 'Denied',
  credited: 'Credited',
  closed: 'Closed',
};

/** Who pays for a failure. */
export const COVERAGES = ['vendor_defect', 'workmanship', 'goodwill'] as const;
export type Coverage = (typeof COVERAGES)[number];
export const COVERAGE_LABELS: Record<Coverage, string> = { vendor_defect: "Vendor's defect", workmanship: "Shop's workmanship", goodwill: 'Goodwill' };

/** Busbar's own list of the ways a component fails. */
export const FAILURE_MODES = [
  'will_not_charge',
  'overheating',
  'cell_or_bms_fault',
  'terminal_corrosion',
  'loose_or_burnt_connection',
  'water_ingress',
  'physical_damage',
  'firmware_fault',
  'other',
] as const;
export type FailureMode = (typeof FAILURE_MODES)[number];
export const FAILURE_MODE_LABELS: Record<FailureMode, string> = {
  will_not_charge: 'Will not charge',
  overheating: 'Overheating',
  cell_or_bms_fault: 'Cell or BMS fault',
  terminal_corrosion: 'Terminal corrosion',
  loose_or_burnt_connection: 'Loose or burnt connection',
  water_ingress: 'Water ingress',
  physical_damage: 'Physical damage',
  firmware_fault: 'Firmware fault',
  other: 'Other',
};

/**
 * The claim workflow and the ability each step needs: the clerk prepares (`update`) and sends
 * (`send`, through "Send to vendor"); the vendor's answer is recorded by someone who may `approve`
 * (a lead up to the location's limit, above it the regional manager); the clerk records the credit.
 */
export const CLAIM_TRANSITIONS: readonly { from: ClaimStatus; to: ClaimStatus; action: 'update' | 'send' | 'approve' }[] = [
  { from: 'logged', to: 'evidence_ready', action: 'update' },
  { from: 'evidence_ready', to: 'logged', action: 'update' },
  // Only through "Send to vendor" (POST /api/claims/:id/send), which e-mails the request first.
  { from: 'evidence_ready', to: 'sent_to_vendor', action: 'send' },
  { from: 'sent_to_vendor', to: 'approved', action: 'approve' },
  { from: 'sent_to_vendor', to: 'denied', action: 'approve' },
  { from: 'approved', to: 'credited', action: 'update' },
  { from: 'credited', to: 'closed', action: 'update' },
  { from: 'denied', to: 'closed', action: 'update' },
];

/**
 * Days a claim may wait in each status before its next step is overdue: Busbar's own service
 * targets (evidence within 3 days, sent within 2, the vendor's answer within 14, the credit within 30).
 */
export const CLAIM_DUE_DAYS: Record<ClaimStatus, number | null> = {
  logged: 3,
  evidence_ready: 2,
  sent_to_vendor: 14,
  approved: 30,
  denied: 7,
  credited: 7,
  closed: null,
};

export function findClaimTransition(from: ClaimStatus, to: ClaimStatus) {
  return CLAIM_TRANSITIONS.find((t) => t.from === from && t.to === to);
}

const isoDate = z.iso.date('Use a date like 2026-03-31');
const cents = z.int('Enter an amount in cents').min(0, 'Cannot be negative').max(100_000_000, 'Too large');

export const claimCreate = z.strictObject({
  buildItemId: z.int().positive({ error: 'Choose the failed component' }),
  failedOn: isoDate,
  failureMode: z.enum(FAILURE_MODES, { error: 'Choose how it failed' }),
  coverage: z.enum(COVERAGES, { error: 'Choose who pays' }),
  symptoms: multilineText(4000, 'Describe what the customer or the shop saw'),
  foundHow: multilineText(1000).default(''),
  laborHours: z.number('Enter hours').min(0, 'Cannot be negative').max(100, 'At most 100 hours').default(0),
  creditRequestedCents: cents.default(0),
});
export type ClaimCreate = z.infer<typeof claimCreate>;

/** Fields that may change while a claim is open; every edit carries the version it was made against. */
export const claimUpdate = z.strictObject({
  version: z.int().min(1),
  failedOn: isoDate.optional(),
  failureMode: z.enum(FAILURE_MODES, { error: 'Choose how it failed' }).optional(),
  coverage: z.enum(COVERAGES, { error: 'Choose who pays' }).optional(),
  symptoms: multilineText(4000, 'Describe what the customer or the shop saw').optional(),
  foundHow: multilineText(1000).optional(),
  laborHours: z.number('Enter hours').min(0, 'Cannot be negative').max(100, 'At most 100 hours').optional(),
  creditRequestedCents: cents.optional(),
  vendorRmaNumber: optionalText(80).optional(),
});
export type ClaimUpdate = z.infer<typeof claimUpdate>;

/** A move along the workflow; approving records the credit the vendor grants, crediting the credit received. */
export const claimStatusChange = z.strictObject({
  version: z.int().min(1),
  to: z.enum(CLAIM_STATUSES, { error: 'Choose a status' }),
  note: multilineText(2000).default(''),
  creditApprovedCents: cents.optional(),
  creditReceivedCents: cents.optional(),
});
export type ClaimStatusChange = z.infer<typeof claimStatusChange>;

const dayRange = (from: string, to: string) => (q: Record<string, unknown>) => !q[from] || !q[to] || String(q[from]) <= String(q[to]);

export const claimQuery = z
  .strictObject({
    status: z.enum(CLAIM_STATUSES).optional(),
    coverage: z.enum(COVERAGES).optional(),
    failureMode: z.enum(FAILURE_MODES).optional(),
    locationId: idSchema.optional(),
    regionId: idSchema.optional(),
    buildId: idSchema.optional(),
    /** The vendor and the catalog category of the failed unit. */
    vendorId: idSchema.optional(),
    category: z.enum(CATEGORIES).optional(),
    /** The day it failed, from and to (inclusive). */
    failedFrom: isoDate.optional(),
    failedTo: isoDate.optional(),
    /** The day it was logged at its location, from and to (inclusive). */
    loggedFrom: isoDate.optional(),
    loggedTo: isoDate.optional(),
    /** Only claims whose next step is past due. */
    overdue: z.literal('true').optional(),
    ...pagingOf(100),
  })
  .refine(dayRange('failedFrom', 'failedTo'), { path: ['failedTo'], message: 'Pick a day on or after the first' })
  .refine(dayRange('loggedFrom', 'loggedTo'), { path: ['loggedTo'], message: 'Pick a day on or after the first' });
export type ClaimQuery = z.infer<typeof claimQuery>;

export interface ClaimView {
  id: number;
  number: string;
  locationId: number;
  buildId: number;
  buildNumber: string;
  buildItemId: number;
  sku: string;
  itemName: string;
  serialNumber: string | null;
  vendorId: number;
  vendorName: string;
  installedOn: string | null;
  failedOn: string;
  failureMode: FailureMode;
  coverage: Coverage;
  symptoms: string;
  foundHow: string;
  laborHours: number;
  /** Past the catalog item's warranty months from the delivery date when logged. */
  outOfWarranty: boolean;
  status: ClaimStatus;
  /** When the next step is due (YYYY-MM-DD, the location's day); null once closed. */
  dueOn: string | null;
  /** The next step is past due today at the claim's location. */
  overdue: boolean;
  vendorRmaNumber: string;
  creditRequestedCents: number;
  creditApprovedCents: number | null;
  creditReceivedCents: number | null;
  /** The build line of the unit put in instead, and its serial number. */
  replacementItemId: number | null;
  replacementSerialNumber: string | null;
  createdAt: string;
  updatedAt: string;
  version: number;
}

export interface ClaimEventView {
  at: string;
  actorName: string | null;
  fromStatus: ClaimStatus | null;
  toStatus: ClaimStatus;
  note: string;
}

/** A photo or document on a claim; a deleted one stays listed with who deleted it and why. */
export interface EvidenceView {
  id: number;
  fileName: string;
  contentType: string;
  sizeBytes: number;
  hasThumbnail: boolean;
  uploadedAt: string;
  uploadedByName: string | null;
  deletedAt: string | null;
  deletedByName: string | null;
  deleteReason: string | null;
}

/** The unit put in instead of the failed one: a new line of the build, the failed unit removed that day. */
export const claimReplacement = z.strictObject({
  version: z.int().min(1),
  serialNumber: serialNumberSchema,
  replacedOn: isoDate,
  /** Another catalog item when the same one is no longer made; the failed unit's when absent. */
  catalogItemId: z.int().positive().optional(),
});

/** "Send to vendor": the version the person saw. */
export const claimSend = z.strictObject({ version: z.int().min(1) });

export const evidenceParams = z.strictObject({ id: idSchema, evidenceId: idSchema });
export const evidenceFileQuery = z.strictObject({ thumbnail: z.literal('true').optional() });
export const evidenceDelete = z.strictObject({ reason: multilineText(500, 'Say why the file is removed') });

export interface ClaimDetail extends ClaimView {
  /** The location's approval limit: a lead approves a credit up to it, the regional manager above it. */
  approvalLimitCents: number;
  events: ClaimEventView[];
  evidence: EvidenceView[];
}
