import { median, MODIFIED_Z_LIMIT, modifiedZScores } from '@busbar/calc';
import fc from 'fast-check';
import jStat from 'jstat';
import { describe, expect, it } from 'vitest';

// Iglewicz and Hoaglin's modified z-score, M = 0.6745 (x − median) / MAD, outlier when |M| > 3.5
// (NIST/SEMATECH e-Handbook of Statistical Methods, 1.3.5.17, from memory).
describe('modified z-scores', () => {
  it('take the median and the median absolute deviation as jstat does', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: -10_000, max: 10_000 }), { minLength: 1, maxLength: 60 }), (values) => {
        expect(median(values)).toBeCloseTo(jStat.median(values), 9);
        const mad = jStat.meddev(values);
        fc.pre(mad > 0);
        const scores = modifiedZScores(values);
        // 0.6745 is the quartile to four places, so the scores agree to about 1 part in 10,000.
        const exact = values.map((v) => (jStat.normal.inv(0.75, 0, 1) * (v - jStat.median(values))) / mad);
        scores.forEach((z, i) => expect(Math.abs(z - exact[i]!)).toBeLessThanOrEqual(1e-4 * Math.abs(exact[i]!) + 1e-12));
      }),
    );
  });

  it("use the normal distribution's third quartile, so MAD / 0.6745 estimates σ", () => {
    expect(jStat.normal.inv(0.75, 0, 1)).toBeCloseTo(0.6745, 4);
  });

  it('mark one value far from nine close ones, and none of the nine', () => {
    const ticketsCents = [410_000, 395_000, 402_000, 420_000, 388_000, 415_000, 399_000, 405_000, 411_000, 690_000];
    const outliers = modifiedZScores(ticketsCents).map((z) => Math.abs(z) > MODIFIED_Z_LIMIT);
    expect(outliers).toEqual([false, false, false, false, false, false, false, false, false, true]);
  });

  it('fall back on the mean absolute deviation when more than half the values are equal', () => {
    // Median 0, MAD 0; mean absolute deviation 12/7; σ ≈ √(π/2) × it (common practice, no source).
    const scores = modifiedZScores([0, 0, 0, 0, 2, 0, 10]);
    expect(scores[6]).toBeCloseTo(10 / (Math.sqrt(Math.PI / 2) * (12 / 7)), 4);
    expect(scores[0]).toBe(0);
    expect(modifiedZScores([5, 5, 5])).toEqual([0, 0, 0]);
  });
});
