import { checkObservations, unitsOf, type SurvivalObservation } from './survival-data.ts';
import { weibullShapeRoot } from './weibull-shape.ts';

export interface WeibullFit {
  shape: number;
  scale: number;
  logLikelihood: number;
}

/** Failures at two distinct times are the fewest that pin down both parameters: with one, or all at one time, the likelihood keeps rising as the shape grows. */
export const WEIBULL_MIN_FAILURE_TIMES = 2;

/**
 * Two-parameter Weibull shape and scale by maximum likelihood with right-censored units
 * (NIST/SEMATECH e-Handbook of Statistical Methods §8.4.1.3): the shape solves
 * Σ tᵢ^β ln tᵢ / Σ tᵢ^β − 1/β − (1/r) Σ_failed ln tᵢ = 0 over all n units and r failures,
 * then scale^β = Σ tᵢ^β / r.
 */
export function weibullFit(observations: readonly SurvivalObservation[]): WeibullFit {
  checkObservations(observations);
  const failureTimes = new Set(observations.filter((o) => o.failed).map((o) => o.time));
  if (failureTimes.size < WEIBULL_MIN_FAILURE_TIMES) {
    throw new RangeError(
      `a Weibull fit needs failures at ${WEIBULL_MIN_FAILURE_TIMES} or more distinct times to estimate both shape and scale; got ${failureTimes.size}`,
    );
  }
  // Times relative to the longest keep t^β within [0, 1] for any shape; the shape does not change.
  const longest = observations.reduce((most, o) => Math.max(most, o.time), 0);
  const all = observations.map((o) => ({ logTime: Math.log(o.time / longest), units: unitsOf(o) }));
  const failed = all.filter((_, i) => observations[i]!.failed);
  const failures = failed.reduce((sum, f) => sum + f.units, 0);
  const shape = weibullShapeRoot(all, failed);
  const powerSum = all.reduce((sum, u) => sum + u.units * Math.exp(shape * u.logTime), 0);
  const scale = (powerSum / failures) ** (1 / shape) * longest;
  // Σ_failed [ln β − β ln η + (β − 1) ln t] − Σ_all (t/η)^β, with Σ_all (t/η)^β = r at the optimum.
  const failedLogSum = failed.reduce((sum, f) => sum + f.units * (f.logTime + Math.log(longest)), 0);
  const logLikelihood = failures * (Math.log(shape) - shape * Math.log(scale)) + (shape - 1) * failedLogSum - failures;
  return { shape, scale, logLikelihood };
}
