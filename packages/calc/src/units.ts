import { checkOneOf } from './checks.ts';
import { AWG_SIZES, type Awg } from './sizes.ts';

// Busbar computes in metres and mm²; feet, circular mils and AWG are for showing and entering.
const METRES_PER_FOOT = 0.3048; // the international foot, exact by definition
const MM2_PER_CIRCULAR_MIL = (Math.PI / 4) * 0.0254 ** 2; // a circle one mil (0.0254 mm) across

/** Metres to feet (international foot, 0.3048 m). */
export function metersToFeet(lengthM: number): number {
  return lengthM / METRES_PER_FOOT;
}

/** Feet to metres (international foot, 0.3048 m). */
export function feetToMeters(lengthFt: number): number {
  return lengthFt * METRES_PER_FOOT;
}

/** Cross-section in mm² to circular mils (1 cmil = π/4 × (0.0254 mm)²). */
export function mm2ToCircularMils(areaMm2: number): number {
  return areaMm2 / MM2_PER_CIRCULAR_MIL;
}

/** Circular mils to mm² (1 cmil = π/4 × (0.0254 mm)²). */
export function circularMilsToMm2(areaCmil: number): number {
  return areaCmil * MM2_PER_CIRCULAR_MIL;
}

/** Circular mils of an AWG size from the gauge's definition (ASTM B258): d = 5 mil × 92^((36 − n) / 39), with 1/0 … 4/0 as n = 0 … −3. */
export function awgCircularMils(awg: Awg): number {
  checkOneOf('awg', awg, AWG_SIZES);
  const n = awg.endsWith('/0') ? 1 - Number(awg[0]) : Number(awg);
  const diameterMil = 5 * 92 ** ((36 - n) / 39);
  return diameterMil ** 2;
}

/** Cross-section of an AWG size in mm² (ASTM B258 diameter). */
export function awgAreaMm2(awg: Awg): number {
  return circularMilsToMm2(awgCircularMils(awg));
}
