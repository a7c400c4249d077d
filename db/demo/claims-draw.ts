import { addMonthsIso, dayOfIso, isoDay, localDay } from '@busbar/calc';
import type { Category, ClaimStatus, Coverage, FailureMode } from '@busbar/shared';
import { between, chance, weighted, type Random } from './draw.ts';
import { FAILURE_RATES, FOUND_HOW, SKU_FAILURE_RATES, SYMPTOMS, VENDOR_MODES, WORKMANSHIP, WORKMANSHIP_FACTOR, BAD_BATCH, TIGHT_DESIGN_FACTOR, yearsToFailure } from './claims-rates.ts';
import { claimAnswer, laterAt } from './claims-answer.ts';
import { pick } from './random.ts';

/** An installed unit as the claims need it: its line, its delivery and what the catalog says of it. */
export interface ClaimUnit {
  itemId: number;
  buildId: number;
  catalogItemId: number;
  sku: string;
  serialNumber: string;
  unitCostCents: number;
  deliveredAt: number;
  category: Category;
  warrantyMonths: number;
  rmaEmail: string;
}

/** A shop with the people who work its claims. */
export interface ClaimShop {
  id: number;
  code: string;
  timeZone: string;
  clerkId: number;
  leadId: number;
  managerId: number;
  approvalLimitCents: number;
}

export interface ClaimStep {
  at: number;
  /** The local day of `at` at the shop. */
  day: number;
  by: number;
  to: ClaimStatus;
  note: string;
}

/** A claim as it happened up to the clock, before it has its number. */
export interface ClaimDraft {
  unit: ClaimUnit;
  shop: ClaimShop;
  failedOn: string;
  failureMode: FailureMode;
  coverage: Coverage;
  symptoms: string;
  foundHow: string;
  laborHours: number;
  outOfWarranty: boolean;
  creditRequestedCents: number;
  creditApprovedCents: number | null;
  creditReceivedCents: number | null;
  vendorRmaNumber: string;
  /** The first step is `logged`; the last is where the claim stands at the clock. */
  steps: ClaimStep[];
  replacement: { at: number; day: number; on: string; by: number } | null;
}

const YEAR_MS = 365.25 * 86_400_000;
const GOODWILL_ASKED_DAYS = 183;

/** When a unit fails (the sooner of its own failure and a loose connection of the shop's, likelier on a build planned past its limits), or null for a category that does not. */
export function failureAt(
  random: Random,
  unit: { sku: string; category: Category; deliveredAt: number; inBadBatch: boolean; tightDesign: boolean },
  shop: ClaimShop,
): { at: number; workmanship: boolean } | null {
  const rate = SKU_FAILURE_RATES[unit.sku] ?? FAILURE_RATES[unit.category];
  if (!rate) return null;
  const own = yearsToFailure(random, unit.inBadBatch ? BAD_BATCH.rate : rate);
  const hazard = (WORKMANSHIP_FACTOR[shop.code] ?? 1) * (unit.tightDesign ? TIGHT_DESIGN_FACTOR : 1);
  const loose = unit.category === 'solar_panel' ? Infinity : yearsToFailure(random, WORKMANSHIP, hazard);
  return { at: unit.deliveredAt + Math.min(own, loose) * YEAR_MS, workmanship: loose < own };
}

function modeOf(random: Random, unit: ClaimUnit, coverage: Coverage, outOfWarranty: boolean): FailureMode {
  if (coverage === 'workmanship') return chance(random, 0.85) ? 'loose_or_burnt_connection' : 'physical_damage';
  // Goodwill inside the warranty: damage that is nobody's defect, covered to keep the customer.
  if (coverage === 'goodwill' && !outOfWarranty) return 'physical_damage';
  return weighted(random, VENDOR_MODES[unit.category]!);
}

/**
 * The claim of a unit that failed before the clock, if it was logged by then, with its steps up to
 * the clock: logged within a week of the failure (past the warranty only as goodwill, by the
 * lead, and less often the longer ago the warranty ended), evidence, the request to the vendor,
 * the vendor's answer, the credit and closing.
 */
export function drawClaim(random: Random, unit: ClaimUnit, shop: ClaimShop, failure: { at: number; workmanship: boolean }, nowMs: number): ClaimDraft | null {
  const failMs = failure.at;
  const zone = shop.timeZone;
  const deliveredOn = isoDay(localDay(zone, unit.deliveredAt));
  const failedDay = localDay(zone, failMs);
  const failedOn = isoDay(failedDay);
  const warrantyEnds = addMonthsIso(deliveredOn, unit.warrantyMonths);
  const outOfWarranty = failedOn > warrantyEnds;
  // Past the warranty, fewer customers ask the longer it has been over; none after six months.
  if (outOfWarranty && !chance(random, 1 - (failedDay - dayOfIso(warrantyEnds)) / GOODWILL_ASKED_DAYS)) return null;
  const logged = laterAt(random, zone, { at: failMs, day: failedDay }, between(random, 0, 6));
  if (logged.at > nowMs) return null;
  const coverage: Coverage = outOfWarranty ? 'goodwill' : failure.workmanship ? 'workmanship' : chance(random, 0.05) ? 'goodwill' : 'vendor_defect';
  const failureMode = modeOf(random, unit, coverage, outOfWarranty);
  const steps: ClaimStep[] = [{ ...logged, by: outOfWarranty ? shop.leadId : shop.clerkId, to: 'logged', note: '' }];
  const draft: ClaimDraft = {
    unit,
    shop,
    failedOn,
    failureMode,
    coverage,
    symptoms: pick(random, SYMPTOMS[failureMode]),
    foundHow: pick(random, FOUND_HOW),
    laborHours: between(random, 0.5, 2.5, 0.25),
    outOfWarranty,
    creditRequestedCents: unit.unitCostCents,
    creditApprovedCents: null,
    creditReceivedCents: null,
    vendorRmaNumber: '',
    steps,
    replacement: null,
  };
  // The shop puts right its own loose connection at once, whatever the vendor says later.
  if (coverage === 'workmanship') draft.replacement = { ...laterAt(random, zone, logged, between(random, 0, 3)), on: '', by: shop.clerkId };
  claimAnswer(random, draft, nowMs);
  return draft;
}
