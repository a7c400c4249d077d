import { checkNumber } from './checks.ts';
import { checkConductorSize, type Awg, type ConductorSize, type Mm2 } from './sizes.ts';
import { feetToMeters } from './units.ts';

// NEC Chapter 9 Table 8, stranded copper at 75 °C, Ω per 1,000 ft: uncoated, then coated (tinned;
// the coated column from memory). The stranded column: for 14–8 AWG it differs from the solid one
// (3.07 / 1.93 / 1.21 / 0.764).
const TABLE_8_OHMS_PER_KFT: Record<Awg, readonly [number, number]> = {
  '18': [7.95, 8.45],
  '16': [4.99, 5.29],
  '14': [3.14, 3.26],
  '12': [1.98, 2.05],
  '10': [1.24, 1.29],
  '8': [0.778, 0.809],
  '6': [0.491, 0.51],
  '4': [0.308, 0.321],
  '3': [0.245, 0.254],
  '2': [0.194, 0.201],
  '1': [0.154, 0.16],
  '1/0': [0.122, 0.127],
  '2/0': [0.0967, 0.101],
  '3/0': [0.0766, 0.0797],
  '4/0': [0.0608, 0.0626],
};
const TABLE_8_C = 75;

// IEC 60228 Table 3, class 5 (flexible) copper, maximum resistance at 20 °C, Ω per km: plain, then
// tinned (the tinned column from memory).
const CLASS_5_OHMS_PER_KM: Record<Mm2, readonly [number, number]> = {
  1.5: [13.3, 13.7],
  2.5: [7.98, 8.21],
  4: [4.95, 5.09],
  6: [3.3, 3.39],
  10: [1.91, 1.95],
  16: [1.21, 1.24],
  25: [0.78, 0.795],
  35: [0.554, 0.565],
  50: [0.386, 0.393],
  70: [0.272, 0.277],
  95: [0.206, 0.21],
};
const CLASS_5_C = 20;

const METRES_PER_KFT = feetToMeters(1000);
/** Copper's inferred zero-resistance temperature, °C (IEC 60228 Annex B: R_t = R_20 × (234.5 + t) / 254.5). */
const COPPER_INFERRED_ZERO_C = 234.5;

/** Copper resistance moved from one temperature to another (IEC 60228 Annex B form). */
export function copperResistanceAt(ohms: number, fromC: number, toC: number): number {
  checkNumber('temperatureC', toC, { min: -60, max: 250 });
  return (ohms * (COPPER_INFERRED_ZERO_C + toC)) / (COPPER_INFERRED_ZERO_C + fromC);
}

export interface ConductorCondition {
  /** Conductor temperature, °C; 75 (Table 8's own) when absent. */
  temperatureC?: number;
  tinned?: boolean;
}

/** DC resistance in Ω/m at one temperature: NEC Chapter 9 Table 8 (stranded copper, 75 °C) for AWG, IEC 60228 Table 3 class 5 (20 °C) for mm², each moved to the temperature asked (75 °C by default) by IEC 60228 Annex B. */
export function conductorResistanceOhmsPerM(size: ConductorSize, { temperatureC = TABLE_8_C, tinned = false }: ConductorCondition = {}): number {
  checkConductorSize('size', size);
  const column = tinned ? 1 : 0;
  if ('awg' in size) return copperResistanceAt(TABLE_8_OHMS_PER_KFT[size.awg][column] / METRES_PER_KFT, TABLE_8_C, temperatureC);
  return copperResistanceAt(CLASS_5_OHMS_PER_KM[size.mm2][column] / 1000, CLASS_5_C, temperatureC);
}

export interface VoltageDropInput extends ConductorCondition {
  currentA: number;
  oneWayLengthM: number;
  size: ConductorSize;
  systemV: number;
}

export interface VoltageDrop {
  dropV: number;
  dropPercent: number;
}

/** Drop over the round trip (2 × one-way length) from the table resistance above at the conductor's temperature; at 75 °C about 20 % more than the K = 10.75 Ω·cmil/ft method gives. */
export function voltageDrop({ currentA, oneWayLengthM, size, systemV, ...condition }: VoltageDropInput): VoltageDrop {
  checkNumber('currentA', currentA, { min: 0 });
  checkNumber('oneWayLengthM', oneWayLengthM, { min: 0 });
  checkNumber('systemV', systemV, { above: 0 });
  const dropV = currentA * 2 * oneWayLengthM * conductorResistanceOhmsPerM(size, condition);
  return { dropV, dropPercent: (100 * dropV) / systemV };
}
