import { funnelLimits, poissonRateInterval, wilsonInterval } from '@busbar/calc';
import jStat from 'jstat';
import { describe, expect, it } from 'vitest';

// Source: Newcombe RG (1998), "Two-sided confidence intervals for the single proportion: comparison of
// seven methods", Stat Med 17:857–872, Table I, 95 % (CHECKS.md [P2]).
describe('Wilson score interval (Newcombe 1998, Table I)', () => {
  it('gives 0.0624–0.1605 for 15/148 without continuity correction', () => {
    const interval = wilsonInterval(15, 148);
    expect(interval.estimate).toBeCloseTo(15 / 148, 12);
    expect(interval.lower).toBeCloseTo(0.0624, 4);
    expect(interval.upper).toBeCloseTo(0.1605, 4);
  });

  it('gives 0.0598–0.1644 for 15/148 with continuity correction', () => {
    const interval = wilsonInterval(15, 148, { continuityCorrection: true });
    expect(interval.lower).toBeCloseTo(0.0598, 4);
    expect(interval.upper).toBeCloseTo(0.1644, 4);
  });

  it('gives 0.0000–0.1611 for 0/20 without continuity correction', () => {
    const interval = wilsonInterval(0, 20);
    expect(interval.lower).toBeCloseTo(0, 12);
    expect(interval.upper).toBeCloseTo(0.1611, 4);
  });

  // From memory (CHECKS.md [M]): further rows of the same table.
  it('gives 0.0000–0.2005 for 0/20 with continuity correction (from memory)', () => {
    const interval = wilsonInterval(0, 20, { continuityCorrection: true });
    expect(interval.lower).toBe(0);
    expect(interval.upper).toBeCloseTo(0.2005, 4);
  });

  it('gives 0.0061–0.1718, and 0.0018–0.1963 corrected, for 1/29 (from memory)', () => {
    const plain = wilsonInterval(1, 29);
    const corrected = wilsonInterval(1, 29, { continuityCorrection: true });
    expect([plain.lower, plain.upper].map((x) => x.toFixed(4))).toEqual(['0.0061', '0.1718']);
    expect([corrected.lower, corrected.upper].map((x) => x.toFixed(4))).toEqual(['0.0018', '0.1963']);
  });

  it('gives 0.2553–0.3662 for 81/263 without continuity correction (from memory)', () => {
    const interval = wilsonInterval(81, 263);
    expect([interval.lower, interval.upper].map((x) => x.toFixed(4))).toEqual(['0.2553', '0.3662']);
  });
});

// Source: NIST/SEMATECH e-Handbook of Statistical Methods §8.4.5.1: time-terminated MTBF limits
// 2T / χ²(1 − α/2; 2r + 2) to 2T / χ²(α/2; 2r); the rate limits are their reciprocals. Factors × the
// MTBF estimate for a 90 % two-sided interval (CHECKS.md [C]).
describe('exact Poisson rate limits (NIST/SEMATECH §8.4.5.1)', () => {
  const factors = [
    { failures: 1, lower: 0.2108, upper: 19.4957 },
    { failures: 3, lower: 0.3869, upper: 3.6689 },
    { failures: 5, lower: 0.4756, upper: 2.5379 },
  ];
  for (const { failures, lower, upper } of factors) {
    it(`gives MTBF factors ${lower}–${upper} for ${failures} failure(s) at 90 %`, () => {
      const hours = 2_000;
      const interval = poissonRateInterval(failures, hours, { confidence: 0.9 });
      const mtbf = hours / failures;
      expect(interval.rate).toBeCloseTo(failures / hours, 12);
      expect(1 / interval.upper / mtbf).toBeCloseTo(lower, 4);
      expect(1 / interval.lower / mtbf).toBeCloseTo(upper, 4);
    });
  }

  it('gives a lower rate of 0 and an upper rate of χ²(0.95; 2) / 2T for no failures at 90 % (NIST §8.4.5.1 with r = 0)', () => {
    const interval = poissonRateInterval(0, 1_000, { confidence: 0.9 });
    expect(interval.lower).toBe(0);
    expect(interval.upper).toBeCloseTo(jStat.chisquare.inv(0.95, 2) / 2_000, 12);
  });

  it('agrees with the chi-square limits computed by jstat at 95 %', () => {
    for (const events of [1, 2, 7, 40, 300]) {
      const interval = poissonRateInterval(events, 5_000);
      expect(interval.lower).toBeCloseTo(jStat.chisquare.inv(0.025, 2 * events) / 10_000, 12);
      expect(interval.upper).toBeCloseTo(jStat.chisquare.inv(0.975, 2 * events + 2) / 10_000, 12);
    }
  });
});

// Source: Spiegelhalter DJ (2005), "Funnel plots for comparing institutional performance", Stat Med
// 24:1185–1202, appendix: the limit is r_p − (F(r_p) − p) / (F(r_p) − F(r_p − 1)) expected events over
// the exposure, r_p the p-quantile of a Poisson count. Recomputed here with jstat's Poisson CDF.
describe('funnel limits (Spiegelhalter 2005)', () => {
  const jstatQuantile = (p: number, mean: number) => {
    let count = 0;
    while (jStat.poisson.cdf(count, mean) < p) count++;
    return count;
  };
  const jstatLimit = (p: number, mean: number) => {
    const count = jstatQuantile(p, mean);
    const at = jStat.poisson.cdf(count, mean);
    const below = count === 0 ? 0 : jStat.poisson.cdf(count - 1, mean);
    return Math.max(0, count - (at - p) / (at - below));
  };

  for (const confidence of [0.95, 0.998]) {
    it(`matches the interpolated Poisson limits computed with jstat at ${confidence}`, () => {
      const networkRate = 0.004; // failures per unit-month
      for (const exposure of [50, 400, 1_250, 6_000, 20_000]) {
        const limits = funnelLimits(networkRate, exposure, { confidence });
        const mean = networkRate * exposure;
        const alpha = 1 - confidence;
        expect(limits.rate).toBe(networkRate);
        expect(limits.lower * exposure).toBeCloseTo(jstatLimit(alpha / 2, mean), 9);
        expect(limits.upper * exposure).toBeCloseTo(jstatLimit(1 - alpha / 2, mean), 9);
      }
    });
  }

  it('approaches the normal limits θ ± z·√(θ / exposure) at large exposure (Spiegelhalter 2005, §3)', () => {
    const networkRate = 0.004;
    const exposure = 5_000_000;
    const limits = funnelLimits(networkRate, exposure);
    const halfWidth = jStat.normal.inv(0.975, 0, 1) * Math.sqrt(networkRate / exposure);
    expect(limits.lower).toBeCloseTo(networkRate - halfWidth, 6);
    expect(limits.upper).toBeCloseTo(networkRate + halfWidth, 6);
  });
});
