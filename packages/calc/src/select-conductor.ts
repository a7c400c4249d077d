import { conductorAmpacityA, type InsulationRatingC } from './ampacity.ts';
import { checkNumber } from './checks.ts';
import { voltageDrop } from './conductors.ts';
import { conductorSizes, type ConductorSize, type Gauge } from './sizes.ts';

export interface ConductorRequest {
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
  /** The limit that rules out the next smaller size; 'drop' when both do, or when the smallest size fits. */
  decidedBy: 'drop' | 'ampacity';
}

/** Smallest size whose round-trip drop (Table 8 / IEC 60228 resistance) is within the allowed percent and whose 33 CFR 183.425 amperage carries the current; null when no size does. */
export function selectConductor(request: ConductorRequest): ConductorChoice | null {
  const { currentA, oneWayLengthM, systemV, maxDropPercent, gauge, ...rating } = request;
  checkNumber('currentA', currentA, { above: 0 });
  checkNumber('oneWayLengthM', oneWayLengthM, { above: 0 });
  checkNumber('maxDropPercent', maxDropPercent, { above: 0, max: 100 });
  const sizes = conductorSizes(gauge);
  const drops = sizes.map((size) => voltageDrop({ currentA, oneWayLengthM, size, systemV }));
  const ampacities = sizes.map((size) => conductorAmpacityA({ size, ...rating }));
  // Resistance falls and amperage rises with size, so each limit is met from its first size on.
  const firstByDrop = drops.findIndex((drop) => drop.dropPercent <= maxDropPercent);
  const firstByAmpacity = ampacities.findIndex((ampacityA) => ampacityA >= currentA);
  if (firstByDrop < 0 || firstByAmpacity < 0) return null;
  const index = Math.max(firstByDrop, firstByAmpacity);
  return {
    size: sizes[index]!,
    ...drops[index]!,
    ampacityA: ampacities[index]!,
    decidedBy: firstByAmpacity > firstByDrop ? 'ampacity' : 'drop',
  };
}
