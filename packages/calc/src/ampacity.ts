import { checkNumber, checkOneOf } from './checks.ts';
import { AWG_SIZES, checkConductorSize, type Awg, type ConductorSize, type Mm2 } from './sizes.ts';
import { awgAreaMm2 } from './units.ts';

/** Insulation temperature ratings (°C) with a column in 33 CFR 183.425 Table 5. */
export const INSULATION_RATINGS_C = [60, 75, 80, 90, 105, 125, 200] as const;
export type InsulationRatingC = (typeof INSULATION_RATINGS_C)[number];

// 33 CFR 183.425 Table 5: allowable amperage at 30 °C ambient, one column per rating above.
const TABLE_5_A: Record<Awg, readonly number[]> = {
  '18': [10, 10, 15, 20, 20, 25, 25],
  '16': [15, 15, 20, 25, 25, 30, 35],
  '14': [20, 20, 25, 30, 35, 40, 45],
  '12': [25, 25, 35, 40, 45, 50, 55],
  '10': [40, 40, 50, 55, 60, 70, 70],
  '8': [55, 65, 70, 70, 80, 90, 100],
  '6': [80, 95, 100, 100, 120, 125, 135],
  '4': [105, 125, 130, 135, 160, 170, 180],
  '3': [120, 145, 150, 155, 180, 195, 210],
  '2': [140, 170, 175, 180, 210, 225, 240],
  '1': [165, 195, 210, 210, 245, 265, 280],
  '1/0': [195, 230, 245, 245, 285, 305, 325],
  '2/0': [225, 265, 285, 285, 330, 355, 370],
  '3/0': [260, 310, 330, 330, 385, 410, 430],
  '4/0': [300, 360, 385, 385, 445, 475, 510],
};

// Correction for engine spaces (50 °C ambient). 105 °C is read from the regulation; the other
// ratings are the commonly quoted factors, not checked against it.
const ENGINE_SPACE_FACTOR: Record<InsulationRatingC, number> = { 60: 0.58, 75: 0.75, 80: 0.78, 90: 0.82, 105: 0.85, 125: 0.89, 200: 1 };

// Derating for current-carrying conductors run together, as commonly quoted with Table 5.
function bundlingFactor(conductors: number): number {
  if (conductors >= 25) return 0.4;
  if (conductors >= 7) return 0.5;
  if (conductors >= 4) return 0.6;
  if (conductors === 3) return 0.7;
  return 1;
}

/** The AWG size Table 5 is read at for a metric conductor: the largest AWG whose cross-section (ASTM B258) does not exceed it, so no metric wire is credited with a bigger wire's amperage. */
export function ampacityAwgForMm2(mm2: Mm2): Awg {
  checkConductorSize('mm2', { mm2 });
  // 18 AWG (0.82 mm²) is smaller than every metric size, so the list is never empty.
  return AWG_SIZES.filter((awg) => awgAreaMm2(awg) <= mm2).at(-1)!;
}

export interface AmpacityInput {
  size: ConductorSize;
  insulationC: InsulationRatingC;
  engineSpace?: boolean;
  /** Current-carrying conductors in the bundle this one runs in; 1 or absent when it runs alone. */
  bundledConductors?: number;
}

/** Allowable current in A: 33 CFR 183.425 Table 5 at the insulation rating, times the engine-space and the bundling factors when they apply (both together). */
export function conductorAmpacityA({ size, insulationC, engineSpace = false, bundledConductors = 1 }: AmpacityInput): number {
  checkConductorSize('size', size);
  checkOneOf('insulationC', insulationC, INSULATION_RATINGS_C);
  checkNumber('bundledConductors', bundledConductors, { min: 1, integer: true });
  const awg = 'awg' in size ? size.awg : ampacityAwgForMm2(size.mm2);
  const tableA = TABLE_5_A[awg][INSULATION_RATINGS_C.indexOf(insulationC)]!;
  const engineFactor = engineSpace ? ENGINE_SPACE_FACTOR[insulationC] : 1;
  return tableA * engineFactor * bundlingFactor(bundledConductors);
}
