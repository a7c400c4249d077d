import { kaplanMeier, weibullAgeTrend, weibullFit, type SurvivalObservation } from '@busbar/calc';
import jStat from 'jstat';
import { describe, expect, it } from 'vitest';

// "6+" is a unit censored at 6.
const parse = (text: string): SurvivalObservation[] =>
  text.split(' ').map((item) => ({ time: Number.parseFloat(item), failed: !item.endsWith('+') }));

// Source: Freireich et al. (1963), 6-MP arm, weeks of remission, as printed in Klein & Moeschberger,
// Survival Analysis (2003) §1.2, with its Kaplan–Meier estimates and Greenwood standard errors (CHECKS.md [P2]).
describe('Kaplan–Meier on the 6-MP remission data (Freireich 1963)', () => {
  const rows = kaplanMeier(parse('6 6 6 6+ 7 9+ 10 10+ 11+ 13 16 17+ 19+ 20+ 22 23 25+ 32+ 32+ 34+ 35+'));

  it('has a row at each distinct remission end with the published survival', () => {
    expect(rows.map((row) => row.time)).toEqual([6, 7, 10, 13, 16, 22, 23]);
    expect(rows.map((row) => row.atRisk)).toEqual([21, 17, 15, 12, 11, 7, 6]);
    expect(rows.map((row) => row.events)).toEqual([3, 1, 1, 1, 1, 1, 1]);
    expect(rows.map((row) => row.survival.toFixed(3))).toEqual(['0.857', '0.807', '0.753', '0.690', '0.627', '0.538', '0.448']);
  });

  it('gives Greenwood standard errors 0.0764 at 6 weeks and 0.1346 at 23 weeks', () => {
    expect(rows[0]!.standardError).toBeCloseTo(0.0764, 4);
    expect(rows[6]!.standardError).toBeCloseTo(0.1346, 4);
  });

  // From memory: the log-log 95 % band at 6 weeks as a survival package prints it, 0.620–0.952.
  it('gives the log-log 95 % band 0.620–0.952 at 6 weeks (from memory)', () => {
    expect(rows[0]!.lower).toBeCloseTo(0.62, 3);
    expect(rows[0]!.upper).toBeCloseTo(0.952, 3);
  });
});

// Source: NIST/SEMATECH e-Handbook of Statistical Methods §8.4.1.3, maximum likelihood for a Weibull
// with censoring: ten failures and ten units censored at 500 h (CHECKS.md [P]).
describe('Weibull maximum likelihood with censoring (NIST/SEMATECH §8.4.1.3)', () => {
  const observations = parse('54 187 216 240 244 335 361 373 375 386 500+ 500+ 500+ 500+ 500+ 500+ 500+ 500+ 500+ 500+');
  const fit = weibullFit(observations);

  it('gives shape 1.7208, scale 606.528 and log-likelihood −75.135', () => {
    expect(fit.shape).toBeCloseTo(1.7208, 4);
    expect(fit.scale).toBeCloseTo(606.528, 3);
    expect(fit.logLikelihood).toBeCloseTo(-75.135, 3);
  });

  // Independent library: jstat 1.9.6's Weibull density and distribution, which take (x, scale, shape).
  const jstatLogLikelihood = (shape: number, scale: number) =>
    observations.reduce(
      (sum, { time, failed }) => sum + Math.log(failed ? jStat.weibull.pdf(time, scale, shape) : 1 - jStat.weibull.cdf(time, scale, shape)),
      0,
    );

  it('reports the log-likelihood that jstat computes at the fitted parameters', () => {
    expect(fit.logLikelihood).toBeCloseTo(jstatLogLikelihood(fit.shape, fit.scale), 9);
  });

  it('is the maximum: any nearby shape or scale is less likely by jstat', () => {
    for (const [shapeStep, scaleStep] of [[1.01, 1], [0.99, 1], [1, 1.01], [1, 0.99], [1.01, 1.01], [0.99, 0.99]] as const) {
      expect(jstatLogLikelihood(fit.shape * shapeStep, fit.scale * scaleStep)).toBeLessThan(fit.logLikelihood);
    }
  });

  // The exponential is the Weibull of shape 1: its likelihood by jstat at the censored MLE rate r / Σt.
  it('tests the fitted shape against a steady rate with the likelihood ratio that jstat gives', () => {
    const trend = weibullAgeTrend(observations);
    const totalTime = observations.reduce((sum, o) => sum + o.time, 0);
    const exponential = jstatLogLikelihood(1, totalTime / 10);
    expect(trend.statistic).toBeCloseTo(2 * (fit.logLikelihood - exponential), 9);
    // About 2.84: under 3.84, the chi-square 95 % point on one degree of freedom, so ten failures do not
    // tell a shape of 1.72 from a steady rate at 95 %; over 2.71, the 90 % point (printed tables, from memory).
    expect(trend.statistic).toBeGreaterThan(2.706);
    expect(trend.statistic).toBeLessThan(3.841);
    expect(trend.trend).toBe('steady');
    expect(weibullAgeTrend(observations, { confidence: 0.9 }).trend).toBe('wear_out');
  });
});
