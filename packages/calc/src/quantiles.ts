import binomialCdfOf from '@stdlib/stats-base-dists-binomial-cdf';
import chisquareQuantile from '@stdlib/stats-base-dists-chisquare-quantile';
import normalQuantile from '@stdlib/stats-base-dists-normal-quantile';
import poissonCdfOf from '@stdlib/stats-base-dists-poisson-cdf';
import poissonQuantileOf from '@stdlib/stats-base-dists-poisson-quantile';
import { checkNumber } from './checks.ts';

// Distribution functions come from @stdlib (checked against jstat in tests/external), not our own series.

/** Standard normal quantile z with P(Z ≤ z) = p (@stdlib/stats-base-dists-normal-quantile). */
export function standardNormalQuantile(p: number): number {
  return normalQuantile(p, 0, 1);
}

/** Chi-square quantile x with P(X ≤ x) = p on `degreesOfFreedom` (@stdlib/stats-base-dists-chisquare-quantile). */
export function chiSquareQuantile(p: number, degreesOfFreedom: number): number {
  return chisquareQuantile(p, degreesOfFreedom);
}

/** Smallest count k with P(X ≤ k) ≥ p for a Poisson mean (@stdlib/stats-base-dists-poisson-quantile). */
export function poissonQuantile(p: number, mean: number): number {
  return poissonQuantileOf(p, mean);
}

/** P(X ≤ count) for a Poisson mean (@stdlib/stats-base-dists-poisson-cdf). */
export function poissonCdf(count: number, mean: number): number {
  return poissonCdfOf(count, mean);
}

/** P(X ≥ count) for a binomial of `trials` with success probability `p` (@stdlib/stats-base-dists-binomial-cdf). */
export function binomialUpperTail(count: number, trials: number, p: number): number {
  return count <= 0 ? 1 : 1 - binomialCdfOf(count - 1, trials, p);
}

/** Two-sided tail probability α of a confidence level, rejecting levels outside (0, 1). */
export function tailOf(confidence: number): number {
  checkNumber('confidence', confidence, { above: 0, below: 1 });
  return 1 - confidence;
}
