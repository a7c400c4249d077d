/**
 * Outliers among the locations' figures by Iglewicz and Hoaglin's modified z-score (How to Detect
 * and Handle Outliers, ASQC 1993; the NIST/SEMATECH e-Handbook of Statistical Methods, 1.3.5.17,
 * repeats the rule): M = 0.6745 (x − median) / MAD, an outlier when |M| > 3.5. Median and MAD are
 * not pulled by the outliers themselves, as a mean and standard deviation would be.
 */
export const MODIFIED_Z_LIMIT = 3.5;
/** The normal distribution's third quartile, so that MAD / 0.6745 estimates σ of normal data. */
const Q3_NORMAL = 0.6745;
/** √(π/2): mean absolute deviation × 1.2533 estimates σ of normal data, used where MAD is 0. */
const MEAN_DEVIATION_SIGMA = 1.253314;

/** The middle value (the mean of the two middle ones for an even count); NaN for none. */
export function median(values: readonly number[]): number {
  if (values.length === 0) return Number.NaN;
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[middle]! : (sorted[middle - 1]! + sorted[middle]!) / 2;
}

/**
 * Each value's modified z-score among `values`. Where more than half the values are equal (MAD 0),
 * the spread is the mean absolute deviation from the median instead (σ ≈ 1.2533 × it, common
 * practice, no source); where every value is equal, each score is 0.
 */
export function modifiedZScores(values: readonly number[]): number[] {
  const centre = median(values);
  const deviations = values.map((v) => Math.abs(v - centre));
  const mad = median(deviations);
  if (mad > 0) return values.map((v) => (Q3_NORMAL * (v - centre)) / mad);
  const meanDeviation = deviations.reduce((a, b) => a + b, 0) / Math.max(values.length, 1);
  if (meanDeviation === 0) return values.map(() => 0);
  return values.map((v) => (v - centre) / (MEAN_DEVIATION_SIGMA * meanDeviation));
}
