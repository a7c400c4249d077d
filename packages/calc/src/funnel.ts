import { checkNumber } from './checks.ts';
import type { RateInterval } from './poisson-rate.ts';
import { poissonCdf, poissonQuantile, tailOf } from './quantiles.ts';

/**
 * Funnel-plot control limits for a location's event rate at its own exposure, around the network's
 * rate: the Poisson quantiles of the expected count, interpolated between whole counts so the limits
 * run smoothly with exposure (Spiegelhalter 2005, "Funnel plots for comparing institutional performance",
 * Stat Med 24:1185–1202, appendix). A location whose rate lies outside [lower, upper] differs from the
 * network by more than chance at that confidence; Spiegelhalter draws 0.95 and 0.998. Interpolation
 * below a count of 0 stops at 0: where even one event is past the upper quantile, the upper limit is 0.
 */
export function funnelLimits(networkRate: number, exposure: number, options: { confidence?: number } = {}): RateInterval {
  const { confidence = 0.95 } = options;
  checkNumber('networkRate', networkRate, { above: 0 });
  checkNumber('exposure', exposure, { above: 0 });
  const alpha = tailOf(confidence);
  const expectedCount = networkRate * exposure;
  return {
    rate: networkRate,
    lower: interpolatedQuantile(alpha / 2, expectedCount) / exposure,
    upper: interpolatedQuantile(1 - alpha / 2, expectedCount) / exposure,
  };
}

// r_p − (F(r_p) − p) / (F(r_p) − F(r_p − 1)), with r_p the p-quantile of the count, and no less than 0.
function interpolatedQuantile(p: number, expectedCount: number): number {
  const count = poissonQuantile(p, expectedCount);
  const atCount = poissonCdf(count, expectedCount);
  const below = poissonCdf(count - 1, expectedCount);
  return Math.max(0, count - (atCount - p) / (atCount - below));
}

/**
 * Where `events` at `expected` events (the network's rate times the location's exposure) fall
 * against funnelLimits at the same confidence, from one Poisson CDF F instead of two quantiles:
 * the interpolated upper limit lies in (r − 1, r] for the quantile r, so a whole count exceeds it
 * exactly when F(events) > 1 − α/2; likewise it lies under the lower limit when F(events) < α/2.
 */
export function funnelSide(events: number, expected: number, options: { confidence?: number } = {}): 'above' | 'below' | 'within' {
  const { confidence = 0.95 } = options;
  checkNumber('expected', expected, { above: 0 });
  const alpha = tailOf(confidence);
  const atEvents = poissonCdf(events, expected);
  // No events is never above: where the upper limit would fall below 0 it stops at 0.
  return events > 0 && atEvents > 1 - alpha / 2 ? 'above' : atEvents < alpha / 2 ? 'below' : 'within';
}
