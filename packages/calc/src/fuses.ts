import { checkNumber } from './checks.ts';

/** Ratings (A) of the blade, MIDI, ANL and class-T fuses shops commonly stock (common practice, no source). */
export const STANDARD_FUSE_RATINGS_A = [
  1, 2, 3, 5, 7.5, 10, 15, 20, 25, 30, 35, 40, 50, 60, 70, 80, 100, 110, 125, 150, 175, 200, 225, 250, 300, 325, 350, 400, 500,
] as const;

/** A fuse at least this many times the load does not open in normal running (common practice, no source). */
export const FUSE_MIN_OF_LOAD = 1.25;
/** A fitted fuse at most this many times the conductor's amperage still protects it: the hard ceiling (33 CFR 183.455, circuits under 50 V). */
export const FUSE_MAX_OF_AMPACITY = 1.5;

/** Smallest standard rating ≥ 125 % of the load; null past the largest. */
export function fuseForLoadA(loadA: number): number | null {
  checkNumber('loadA', loadA, { above: 0 });
  return STANDARD_FUSE_RATINGS_A.find((ratingA) => ratingA >= FUSE_MIN_OF_LOAD * loadA) ?? null;
}

export interface FuseRequest {
  loadA: number;
  /** The conductor's allowable current after engine-space and bundling factors, as conductorAmpacityA gives it. */
  conductorAmpacityA: number;
}

/** The fuse Busbar recommends: the smallest standard rating ≥ 125 % of the load, if it is within the conductor's (derated) amperage, stricter than the 150 % 33 CFR 183.455 allows; null otherwise. */
export function selectFuseA({ loadA, conductorAmpacityA }: FuseRequest): number | null {
  checkNumber('conductorAmpacityA', conductorAmpacityA, { above: 0 });
  const fuseA = fuseForLoadA(loadA);
  return fuseA !== null && fuseA <= conductorAmpacityA ? fuseA : null;
}
