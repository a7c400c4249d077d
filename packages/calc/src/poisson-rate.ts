import { checkNumber } from './checks.ts';
import { chiSquareQuantile, tailOf } from './quantiles.ts';

export interface RateInterval {
  rate: number;
  lower: number;
  upper: number;
}

/**
 * Events per unit of exposure with exact two-sided limits from the chi-square distribution:
 * λ from χ²(α/2; 2r) / 2T to χ²(1 − α/2; 2r + 2) / 2T, the reciprocals of the time-terminated
 * MTBF limits of NIST/SEMATECH e-Handbook of Statistical Methods §8.4.5.1. No events: lower limit 0.
 */
export function poissonRateInterval(events: number, exposure: number, options: { confidence?: number } = {}): RateInterval {
  const { confidence = 0.95 } = options;
  checkNumber('events', events, { min: 0, integer: true });
  checkNumber('exposure', exposure, { above: 0 });
  const alpha = tailOf(confidence);
  return {
    rate: events / exposure,
    lower: events === 0 ? 0 : chiSquareQuantile(alpha / 2, 2 * events) / (2 * exposure),
    upper: chiSquareQuantile(1 - alpha / 2, 2 * events + 2) / (2 * exposure),
  };
}
