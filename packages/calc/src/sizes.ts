import { checkOneOf } from './checks.ts';

/** AWG sizes Busbar chooses from, smallest first. */
export const AWG_SIZES = ['18', '16', '14', '12', '10', '8', '6', '4', '3', '2', '1', '1/0', '2/0', '3/0', '4/0'] as const;
/** Metric sizes in mm² Busbar chooses from, smallest first. */
export const MM2_SIZES = [1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95] as const;

export type Awg = (typeof AWG_SIZES)[number];
export type Mm2 = (typeof MM2_SIZES)[number];
export type ConductorSize = { awg: Awg } | { mm2: Mm2 };
export type Gauge = 'awg' | 'mm2';

/** Rejects a size outside the two lists, naming the field. */
export function checkConductorSize(field: string, size: ConductorSize): void {
  if (typeof size === 'object' && size !== null && 'awg' in size) checkOneOf(`${field}.awg`, size.awg, AWG_SIZES);
  else if (typeof size === 'object' && size !== null && 'mm2' in size) checkOneOf(`${field}.mm2`, size.mm2, MM2_SIZES);
  else throw new RangeError(`${field} must give an awg or an mm2 size`);
}

/** Every size of one gauge, smallest first. */
export function conductorSizes(gauge: Gauge): ConductorSize[] {
  return gauge === 'awg' ? AWG_SIZES.map((awg) => ({ awg })) : MM2_SIZES.map((mm2) => ({ mm2 }));
}

/** A size as people write it: "10 AWG", "6 mm²". */
export function conductorLabel(size: ConductorSize): string {
  return 'awg' in size ? `${size.awg} AWG` : `${size.mm2} mm²`;
}
