import { chiSquareQuantile, tailOf } from './quantiles.ts';
import { unitsOf, type SurvivalObservation } from './survival-data.ts';
import { weibullFit, type WeibullFit } from './weibull-fit.ts';

export type AgeTrend = 'early' | 'steady' | 'wear_out';

/**
 * Whether failures come more often young (shape below 1) or old (above 1), or at a rate the data
 * cannot tell from steady: the likelihood-ratio test of the exponential (a Weibull of shape 1)
 * against the Weibull fit, 2(ℓ_Weibull − ℓ_exponential) against the chi-square quantile on one
 * degree of freedom (Lawless, Statistical Models and Methods for Lifetime Data, 2nd ed. 2003,
 * likelihood-ratio tests; from memory). With censoring, the exponential's rate is failures over the
 * total time and ℓ = −r ln(Σt / r) − r, in the same form as weibullFit's log-likelihood.
 */
export function weibullAgeTrend(observations: readonly SurvivalObservation[], options: { confidence?: number } = {}): WeibullFit & { statistic: number; trend: AgeTrend } {
  const { confidence = 0.95 } = options;
  const fit = weibullFit(observations);
  const failures = observations.reduce((sum, o) => sum + (o.failed ? unitsOf(o) : 0), 0);
  const totalTime = observations.reduce((sum, o) => sum + unitsOf(o) * o.time, 0);
  const exponential = -failures * Math.log(totalTime / failures) - failures;
  const statistic = Math.max(0, 2 * (fit.logLikelihood - exponential));
  const clear = statistic > chiSquareQuantile(1 - tailOf(confidence), 1);
  return { ...fit, statistic, trend: !clear ? 'steady' : fit.shape < 1 ? 'early' : 'wear_out' };
}
