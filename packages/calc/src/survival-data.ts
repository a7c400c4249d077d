import { checkNumber } from './checks.ts';

/** One unit's time in service: until it failed, or until it was last seen working (right-censored). */
export interface SurvivalObservation {
  time: number;
  failed: boolean;
}

/** Rejects an empty list and times that are not positive finite numbers, naming the offending row. */
export function checkObservations(observations: readonly SurvivalObservation[]): void {
  if (observations.length === 0) throw new RangeError('observations must hold at least one unit');
  observations.forEach((observation, index) => {
    checkNumber(`observations[${index}].time`, observation.time, { above: 0 });
    if (typeof observation.failed !== 'boolean') throw new RangeError(`observations[${index}].failed must be true or false`);
  });
}
