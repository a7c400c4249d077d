import { conductorAmpacityA, type InsulationRatingC } from './ampacity.ts';
import { checkNumber } from './checks.ts';
import { voltageDrop, type ConductorCondition } from './conductors.ts';
import { FUSE_MIN_OF_LOAD, fuseForLoadA } from './fuses.ts';
import { conductorSizes, type ConductorSize, type Gauge } from './sizes.ts';

/** Smallest conductor Busbar recommends: 16 AWG, 1.5 mm² (33 CFR 183.425(e), conductors installed separately). */
export const MIN_RECOMMENDED_SIZE: Record<Gauge, ConductorSize> = { awg: { awg: '16' }, mm2: { mm2: 1.5 } };

export interface ConductorRequest extends ConductorCondition {
  currentA: number;
  oneWayLengthM: number;
  systemV: number;
  maxDropPercent: number;
  insulationC: InsulationRatingC;
  engineSpace?: boolean;
  bundledConductors?: number;
  gauge: Gauge;
}

export interface ConductorChoice {
  size: ConductorSize;
  dropV: number;
  dropPercent: number;
  ampacityA: number;
  /** The limit that rules out the next smaller size: the drop, the amperage (which must cover the fuse), or the smallest size recommended. */
  decidedBy: 'drop' | 'ampacity' | 'minimum';
}

/**
 * Smallest size, 16 AWG / 1.5 mm² at least, whose round-trip drop at the conductor's temperature is
 * within the allowed percent and whose 33 CFR 183.425 amperage carries the fuse that protects it
 * (the smallest standard rating ≥ 125 % of the current); null when no size does.
 */
export function selectConductor(request: ConductorRequest): ConductorChoice | null {
  const { currentA, oneWayLengthM, systemV, maxDropPercent, gauge, temperatureC, tinned, ...rating } = request;
  checkNumber('currentA', currentA, { above: 0 });
  checkNumber('oneWayLengthM', oneWayLengthM, { above: 0 });
  checkNumber('maxDropPercent', maxDropPercent, { above: 0, max: 100 });
  const sizes = conductorSizes(gauge);
  const drops = sizes.map((size) => voltageDrop({ currentA, oneWayLengthM, size, systemV, temperatureC, tinned }));
  const ampacities = sizes.map((size) => conductorAmpacityA({ size, ...rating }));
  // Past the largest standard fuse, the wire must still carry 125 % of the current.
  const neededA = fuseForLoadA(currentA) ?? FUSE_MIN_OF_LOAD * currentA;
  // Resistance falls and amperage rises with size, so each limit is met from its first size on.
  const firstByDrop = drops.findIndex((drop) => drop.dropPercent <= maxDropPercent);
  const firstByAmpacity = ampacities.findIndex((ampacityA) => ampacityA >= neededA);
  if (firstByDrop < 0 || firstByAmpacity < 0) return null;
  const smallest = sizes.findIndex((size) => JSON.stringify(size) === JSON.stringify(MIN_RECOMMENDED_SIZE[gauge]));
  const index = Math.max(firstByDrop, firstByAmpacity, smallest);
  const decidedBy = index === smallest && smallest > Math.max(firstByDrop, firstByAmpacity) ? 'minimum' : firstByAmpacity > firstByDrop ? 'ampacity' : 'drop';
  return { size: sizes[index]!, ...drops[index]!, ampacityA: ampacities[index]!, decidedBy };
}
