import { checkNumber } from './checks.ts';
import { standardNormalQuantile, tailOf } from './quantiles.ts';

export interface ProportionInterval {
  estimate: number;
  lower: number;
  upper: number;
}

export interface WilsonOptions {
  confidence?: number;
  continuityCorrection?: boolean;
}

/**
 * Wilson score interval for failures out of trials, optionally with continuity correction
 * (Newcombe 1998, "Two-sided confidence intervals for the single proportion", Stat Med 17:857–872, methods 3 and 4).
 */
export function wilsonInterval(failures: number, trials: number, options: WilsonOptions = {}): ProportionInterval {
  const { confidence = 0.95, continuityCorrection = false } = options;
  checkNumber('trials', trials, { min: 1, integer: true });
  checkNumber('failures', failures, { min: 0, max: trials, integer: true });
  const z = standardNormalQuantile(1 - tailOf(confidence) / 2);
  const p = failures / trials;
  const q = 1 - p;
  const centre = 2 * trials * p + z * z;
  const denominator = 2 * (trials + z * z);
  // Rounding can carry a limit a hair past 0 or 1 when no trial or every trial failed.
  if (!continuityCorrection) {
    const spread = z * Math.sqrt(z * z + 4 * trials * p * q);
    return { estimate: p, lower: Math.max(0, (centre - spread) / denominator), upper: Math.min(1, (centre + spread) / denominator) };
  }
  // Newcombe's method 4 sets the limit to 0 (or 1) when no trial failed (or all did).
  const lower = failures === 0 ? 0 : (centre - 1 - z * Math.sqrt(z * z - 2 - 1 / trials + 4 * p * (trials * q + 1))) / denominator;
  const upper = failures === trials ? 1 : (centre + 1 + z * Math.sqrt(z * z + 2 - 1 / trials + 4 * p * (trials * q - 1))) / denominator;
  return { estimate: p, lower: Math.max(0, lower), upper: Math.min(1, upper) };
}
