import { chiSquareQuantile, poissonCdf, poissonQuantile, standardNormalQuantile } from '@busbar/calc';
import jStat from 'jstat';
import { describe, expect, it } from 'vitest';

const probabilities = [0.0005, 0.001, 0.005, 0.025, 0.05, 0.1, 0.3, 0.5, 0.7, 0.9, 0.95, 0.975, 0.995, 0.999, 0.9995];

// Independent library: jstat 1.9.6 (CHECKS.md [C]: it and @stdlib agree to 1e-10).
describe('distribution functions agree with jstat', () => {
  it('standard normal quantiles', () => {
    for (const p of probabilities) expect(standardNormalQuantile(p)).toBeCloseTo(jStat.normal.inv(p, 0, 1), 9);
  });

  it('chi-square quantiles for 1 to 400 degrees of freedom', () => {
    for (const df of [1, 2, 3, 4, 6, 10, 21, 50, 101, 400]) {
      for (const p of probabilities) {
        const expected = jStat.chisquare.inv(p, df);
        expect(Math.abs(chiSquareQuantile(p, df) - expected) / expected).toBeLessThan(1e-9);
      }
    }
  });

  it('Poisson cumulative probabilities, directly and through P(X ≤ k) = 1 − F_χ²(2μ; 2k + 2), and the quantiles they imply', () => {
    for (const mean of [0.05, 0.8, 3, 12.5, 60, 400]) {
      for (let count = 0; count <= 2 * mean + 10; count++) {
        // jstat's Poisson CDF sums factorials and overflows before a mean of 150.
        if (mean < 100) expect(poissonCdf(count, mean)).toBeCloseTo(jStat.poisson.cdf(count, mean), 10);
        expect(poissonCdf(count, mean)).toBeCloseTo(1 - jStat.chisquare.cdf(2 * mean, 2 * count + 2), 9);
      }
      for (const p of probabilities) {
        const count = poissonQuantile(p, mean);
        expect(1 - jStat.chisquare.cdf(2 * mean, 2 * count + 2)).toBeGreaterThanOrEqual(p - 1e-12);
        if (count > 0) expect(1 - jStat.chisquare.cdf(2 * mean, 2 * count)).toBeLessThan(p);
      }
    }
  });
});

// Textbook table values (from memory: the standard normal and chi-square tables printed in any statistics text).
describe('distribution functions match printed tables (from memory)', () => {
  it('normal: z(0.95) = 1.6449, z(0.975) = 1.9600, z(0.995) = 2.5758', () => {
    expect(standardNormalQuantile(0.95)).toBeCloseTo(1.6449, 4);
    expect(standardNormalQuantile(0.975)).toBeCloseTo(1.96, 4);
    expect(standardNormalQuantile(0.995)).toBeCloseTo(2.5758, 4);
  });

  it('chi-square: 3.841 (0.95, 1 df), 9.488 (0.95, 4 df), 0.103 (0.05, 2 df), 20.483 (0.975, 10 df), 3.247 (0.025, 10 df)', () => {
    expect(chiSquareQuantile(0.95, 1)).toBeCloseTo(3.841, 3);
    expect(chiSquareQuantile(0.95, 4)).toBeCloseTo(9.488, 3);
    expect(chiSquareQuantile(0.05, 2)).toBeCloseTo(0.103, 3);
    expect(chiSquareQuantile(0.975, 10)).toBeCloseTo(20.483, 3);
    expect(chiSquareQuantile(0.025, 10)).toBeCloseTo(3.247, 3);
  });
});
