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
  /** Charging voltage per 12 V of system voltage (absorption), V. */
  absorptionV: number;
  /** Lead-acid: above this state of charge (0–1) the bank accepts at most acceptC × its rating per hour. */
  taper?: { knee: number; acceptC: number };
}

// Cell voltages and depths of discharge as commonly given (2.0 V and 50 % for lead-acid, 3.2 V and
// 80–100 % for LiFePO4, from memory); absorption voltages as makers commonly set them (from memory);
// exponents, efficiencies, charge rates and the lead-acid taper (the last 20 % takes about four hours
// whatever the charger) are common practice, no source.
const LEAD_ACID_TAPER = { knee: 0.8, acceptC: 0.05 };

export const BATTERY_CHEMISTRIES: Record<Chemistry, ChemistryData> = {
  lifepo4: { label: 'LiFePO4', cellV: 3.2, defaultDepthOfDischarge: 0.8, peukertExponent: 1, chargeEfficiency: 0.95, chargeRateC: { min: 0.2, max: 0.5 }, absorptionV: 14.4 },
  agm: { label: 'AGM', cellV: 2, defaultDepthOfDischarge: 0.5, peukertExponent: 1.1, chargeEfficiency: 0.9, chargeRateC: { min: 0.1, max: 0.3 }, absorptionV: 14.7, taper: LEAD_ACID_TAPER },
  flooded: { label: 'flooded lead-acid', cellV: 2, defaultDepthOfDischarge: 0.5, peukertExponent: 1.25, chargeEfficiency: 0.85, chargeRateC: { min: 0.1, max: 0.2 }, absorptionV: 14.8, taper: LEAD_ACID_TAPER },
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

/** Peukert's law per hour: drawing currentA for an hour takes drawnAh × (I × H / C)^(k − 1) of the rating, the rated-time form above rearranged (a full bank lasts t hours, so each hour takes C / t); never less than drawn. */
export function peukertDrawAh({ drawnAh, currentA, capacityAh, ratedHours, exponent }: PeukertInput & { drawnAh: number }): number {
  if (currentA <= 0 || exponent === 1) return drawnAh;
  return drawnAh * Math.max(1, ((currentA * ratedHours) / capacityAh) ** (exponent - 1));
}

/**
 * Share of its rated capacity a battery delivers at an air temperature, °C. Lead-acid loses about
 * 0.8 % per °C below 25 °C (about 80 % at 0 °C, 64 % at −20 °C; from memory); LiFePO4 is taken at its rating (its charging in the cold is the hazard, handled apart).
 */
export function coldCapacityFactor(chemistry: Chemistry, temperatureC: number): number {
  checkOneOf('chemistry', chemistry, CHEMISTRIES);
  checkNumber('temperatureC', temperatureC, { min: -60, max: 80 });
  if (chemistry === 'lifepo4') return 1;
  return Math.min(1, 1 - 0.008 * (25 - temperatureC));
}

export interface RefillInput {
  refillAh: number;
  chargerA: number;
  chargeEfficiency: number;
  /** Loads running while charging; 0 when absent. */
  loadA?: number;
  /** Lead-acid: the last tailAh go in at no more than acceptA. */
  taper?: { tailAh: number; acceptA: number };
}

/** Hours of charging to put back refillAh: refill / (charger A × charge efficiency − load A) (charge balance), the taper's tail at its own rate; null when the charger cannot gain on the loads. */
export function hoursToRefill({ refillAh, chargerA, chargeEfficiency, loadA = 0, taper }: RefillInput): number | null {
  checkNumber('refillAh', refillAh, { min: 0 });
  checkNumber('chargerA', chargerA, { min: 0 });
  checkNumber('chargeEfficiency', chargeEfficiency, { above: 0, max: 1 });
  checkNumber('loadA', loadA, { min: 0 });
  const netA = chargerA * chargeEfficiency - loadA;
  if (refillAh === 0) return 0;
  if (netA <= 0) return null;
  const tailAh = Math.min(refillAh, taper?.tailAh ?? 0);
  return (refillAh - tailAh) / netA + (tailAh > 0 ? tailAh / Math.min(netA, taper!.acceptA) : 0);
}
