import { checkNumber } from './checks.ts';

/** One unit's time in service: until it failed, or until it was last seen working (right-censored). */
export interface SurvivalObservation {
  time: number;
  failed: boolean;
  /** Units sharing this time and outcome (1 when absent): a group counts as that many single units. */
  count?: number;
}

/** The number of units an observation stands for. */
export const unitsOf = (observation: SurvivalObservation): number => observation.count ?? 1;

/** Rejects an empty list and times that are not positive finite numbers, naming the offending row. */
export function checkObservations(observations: readonly SurvivalObservation[]): void {
  if (observations.length === 0) throw new RangeError('observations must hold at least one unit');
  observations.forEach((observation, index) => {
    checkNumber(`observations[${index}].time`, observation.time, { above: 0 });
    if (typeof observation.failed !== 'boolean') throw new RangeError(`observations[${index}].failed must be true or false`);
    if (observation.count !== undefined && !(Number.isInteger(observation.count) && observation.count >= 1)) {
      throw new RangeError(`observations[${index}].count must be a whole number of 1 or more`);
    }
  });
}
