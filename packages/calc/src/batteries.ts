import { checkNumber, checkOneOf } from './checks.ts';

export type Chemistry = 'lifepo4' | 'agm' | 'flooded';
export const CHEMISTRIES: readonly Chemistry[] = ['lifepo4', 'agm', 'flooded'];

export interface ChemistryData {
  label: string;
  cellV: number;
  /** Share of the rating planned to be used between charges. */
  defaultDepthOfDischarge: number;
  /** 1 means no Peukert effect (taken so for LiFePO4). */
  peukertExponent: number;
  /** Ah stored per Ah of charge current delivered. */
  chargeEfficiency: number;
  /** Charge current the bank usually wants, as multiples of its Ah rating. */
  chargeRateC: { min: number; max: number };
}

// Cell voltages and depths of discharge as commonly given (2.0 V and 50 % for lead-acid, 3.2 V and
// 80–100 % for LiFePO4, from memory); exponents, efficiencies and charge rates are common practice,
// no source.
export const BATTERY_CHEMISTRIES: Record<Chemistry, ChemistryData> = {
  lifepo4: { label: 'LiFePO4', cellV: 3.2, defaultDepthOfDischarge: 0.8, peukertExponent: 1, chargeEfficiency: 0.95, chargeRateC: { min: 0.2, max: 0.5 } },
  agm: { label: 'AGM', cellV: 2, defaultDepthOfDischarge: 0.5, peukertExponent: 1.1, chargeEfficiency: 0.9, chargeRateC: { min: 0.1, max: 0.3 } },
  flooded: { label: 'flooded lead-acid', cellV: 2, defaultDepthOfDischarge: 0.5, peukertExponent: 1.25, chargeEfficiency: 0.85, chargeRateC: { min: 0.1, max: 0.2 } },
};

/** Lead-acid capacity is rated at the 20-hour discharge (common practice, no source). */
export const DEFAULT_RATED_HOURS = 20;

/** Nominal bank voltage: whole cells in series for the system voltage × the cell voltage (12 V → 4 × 3.2 = 12.8 V LiFePO4, 6 × 2.0 = 12.0 V lead-acid). */
export function bankNominalV(chemistry: Chemistry, systemV: number): number {
  checkOneOf('chemistry', chemistry, CHEMISTRIES);
  checkNumber('systemV', systemV, { above: 0 });
  const cellV = BATTERY_CHEMISTRIES[chemistry].cellV;
  return Math.round(systemV / cellV) * cellV;
}

export interface PeukertInput {
  capacityAh: number;
  ratedHours: number;
  currentA: number;
  exponent: number;
}

/** Peukert's law with the rating: t = H × (C / (I × H))^k (electrotechnik.net 2010 writes t = C / I^k, the same law with C given at a 1 A discharge, i.e. H = C / 1 A). */
export function peukertRuntimeH({ capacityAh, ratedHours, currentA, exponent }: PeukertInput): number {
  checkNumber('capacityAh', capacityAh, { above: 0 });
  checkNumber('ratedHours', ratedHours, { above: 0 });
  checkNumber('currentA', currentA, { above: 0 });
  checkNumber('exponent', exponent, { min: 1, max: 2 });
  return ratedHours * (capacityAh / (currentA * ratedHours)) ** exponent;
}

export interface BankSpec {
  chemistry: Chemistry;
  /** 0–1; the chemistry's default when absent. */
  depthOfDischarge?: number;
  peukertExponent?: number;
  ratedHours?: number;
}

export interface UsableCapacity {
  /** What the bank delivers at the average draw: the Peukert capacity, never more than the rating. */
  effectiveCapacityAh: number;
  usableAh: number;
  depthOfDischarge: number;
}

function specOf(bank: BankSpec) {
  checkOneOf('chemistry', bank.chemistry, CHEMISTRIES);
  const data = BATTERY_CHEMISTRIES[bank.chemistry];
  const spec = {
    depthOfDischarge: bank.depthOfDischarge ?? data.defaultDepthOfDischarge,
    exponent: bank.peukertExponent ?? data.peukertExponent,
    ratedHours: bank.ratedHours ?? DEFAULT_RATED_HOURS,
  };
  checkNumber('depthOfDischarge', spec.depthOfDischarge, { above: 0, max: 1 });
  checkNumber('peukertExponent', spec.exponent, { min: 1, max: 2 });
  checkNumber('ratedHours', spec.ratedHours, { above: 0 });
  return spec;
}

/** Usable capacity at the allowed depth of discharge, lead-acid reduced by Peukert's law at the average draw (never raised above the rating). */
export function usableCapacity(bank: BankSpec & { capacityAh: number; averageCurrentA: number }): UsableCapacity {
  const { depthOfDischarge, exponent, ratedHours } = specOf(bank);
  checkNumber('capacityAh', bank.capacityAh, { above: 0 });
  checkNumber('averageCurrentA', bank.averageCurrentA, { min: 0 });
  // An exponent of 1 is no Peukert effect; skipping it keeps the rating exact.
  const peukertAh =
    bank.averageCurrentA > 0 && exponent > 1
      ? bank.averageCurrentA * peukertRuntimeH({ capacityAh: bank.capacityAh, ratedHours, currentA: bank.averageCurrentA, exponent })
      : bank.capacityAh;
  const effectiveCapacityAh = Math.min(bank.capacityAh, peukertAh);
  return { effectiveCapacityAh, usableAh: effectiveCapacityAh * depthOfDischarge, depthOfDischarge };
}

/** Smallest rating whose usable capacity (as usableCapacity computes it) covers usableAh: Peukert's law solved for C. */
export function capacityForUsableAh(bank: BankSpec & { usableAh: number; averageCurrentA: number }): number {
  const { depthOfDischarge, exponent, ratedHours } = specOf(bank);
  checkNumber('usableAh', bank.usableAh, { min: 0 });
  checkNumber('averageCurrentA', bank.averageCurrentA, { min: 0 });
  const effectiveAh = bank.usableAh / depthOfDischarge;
  if (bank.averageCurrentA === 0 || effectiveAh === 0 || exponent === 1) return effectiveAh;
  const ratedCurrentAh = bank.averageCurrentA * ratedHours;
  return Math.max(effectiveAh, ratedCurrentAh * (effectiveAh / ratedCurrentAh) ** (1 / exponent));
}

export interface RefillInput {
  refillAh: number;
  chargerA: number;
  chargeEfficiency: number;
  /** Loads running while charging; 0 when absent. */
  loadA?: number;
}

/** Hours of charging to put back refillAh: refill / (charger A × charge efficiency − load A) (charge balance); null when the charger cannot gain on the loads. */
export function hoursToRefill({ refillAh, chargerA, chargeEfficiency, loadA = 0 }: RefillInput): number | null {
  checkNumber('refillAh', refillAh, { min: 0 });
  checkNumber('chargerA', chargerA, { min: 0 });
  checkNumber('chargeEfficiency', chargeEfficiency, { above: 0, max: 1 });
  checkNumber('loadA', loadA, { min: 0 });
  const netA = chargerA * chargeEfficiency - loadA;
  if (refillAh === 0) return 0;
  return netA > 0 ? refillAh / netA : null;
}
