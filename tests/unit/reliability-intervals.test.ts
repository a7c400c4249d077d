import { funnelLimits, funnelSide, poissonCdf, poissonRateInterval, wilsonInterval } from '@busbar/calc';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';

const runs = { seed: 10_010, numRuns: 300 };
const trialsAndFailures = fc.integer({ min: 1, max: 5_000 }).chain((trials) => fc.tuple(fc.constant(trials), fc.integer({ min: 0, max: trials })));
const width = (interval: { lower: number; upper: number }) => interval.upper - interval.lower;

describe('wilsonInterval', () => {
  it('holds the estimate inside [0, 1], with or without continuity correction, which only widens it', () => {
    fc.assert(
      fc.property(trialsAndFailures, ([trials, failures]) => {
        const plain = wilsonInterval(failures, trials);
        const corrected = wilsonInterval(failures, trials, { continuityCorrection: true });
        for (const interval of [plain, corrected]) {
          expect(interval.estimate).toBe(failures / trials);
          expect(interval.lower).toBeGreaterThanOrEqual(0);
          expect(interval.lower).toBeLessThanOrEqual(interval.estimate);
          expect(interval.upper).toBeGreaterThanOrEqual(interval.estimate);
          expect(interval.upper).toBeLessThanOrEqual(1);
        }
        expect(corrected.lower).toBeLessThanOrEqual(plain.lower + 1e-15);
        expect(corrected.upper).toBeGreaterThanOrEqual(plain.upper - 1e-15);
      }),
      runs,
    );
  });

  it('widens with confidence and narrows with ten times the trials at the same proportion', () => {
    fc.assert(
      fc.property(trialsAndFailures, ([trials, failures]) => {
        expect(width(wilsonInterval(failures, trials, { confidence: 0.9 }))).toBeLessThan(width(wilsonInterval(failures, trials)));
        expect(width(wilsonInterval(failures, trials))).toBeLessThan(width(wilsonInterval(failures, trials, { confidence: 0.99 })));
        expect(width(wilsonInterval(10 * failures, 10 * trials))).toBeLessThan(width(wilsonInterval(failures, trials)));
      }),
      runs,
    );
  });

  it('mirrors failures and successes', () => {
    fc.assert(
      fc.property(trialsAndFailures, fc.boolean(), ([trials, failures], continuityCorrection) => {
        const failed = wilsonInterval(failures, trials, { continuityCorrection });
        const survived = wilsonInterval(trials - failures, trials, { continuityCorrection });
        expect(failed.lower).toBeCloseTo(1 - survived.upper, 12);
        expect(failed.upper).toBeCloseTo(1 - survived.lower, 12);
      }),
      runs,
    );
  });

  it('rejects negative or fractional counts, more failures than trials, no trials and confidence outside (0, 1)', () => {
    expect(() => wilsonInterval(-1, 10)).toThrow(/failures must be/);
    expect(() => wilsonInterval(1.5, 10)).toThrow(/failures must be a whole number/);
    expect(() => wilsonInterval(11, 10)).toThrow(/failures must be .*at most 10/);
    expect(() => wilsonInterval(0, 0)).toThrow(/trials must be/);
    expect(() => wilsonInterval(1, 10, { confidence: 1 })).toThrow(/confidence must be/);
    expect(() => wilsonInterval(1, 10, { confidence: 0 })).toThrow(/confidence must be/);
  });
});

describe('poissonRateInterval', () => {
  const events = fc.integer({ min: 0, max: 3_000 });
  const exposure = fc.double({ min: 0.5, max: 1e6, noNaN: true });

  it('holds the rate, starts at 0 for no events, widens with confidence and narrows relative to the rate with more events', () => {
    fc.assert(
      fc.property(events, exposure, (count, unitMonths) => {
        const interval = poissonRateInterval(count, unitMonths);
        expect(interval.rate).toBe(count / unitMonths);
        expect(interval.lower).toBeLessThanOrEqual(interval.rate);
        expect(interval.upper).toBeGreaterThan(interval.rate);
        if (count === 0) expect(interval.lower).toBe(0);
        expect(width(poissonRateInterval(count, unitMonths, { confidence: 0.9 }))).toBeLessThan(width(interval));
        const tenfold = poissonRateInterval(10 * count + 10, 10 * unitMonths);
        expect(width(tenfold)).toBeLessThan(width(poissonRateInterval(count + 1, unitMonths)));
      }),
      runs,
    );
  });

  it('scales with exposure', () => {
    fc.assert(
      fc.property(events, exposure, (count, unitMonths) => {
        const once = poissonRateInterval(count, unitMonths);
        const twice = poissonRateInterval(count, 2 * unitMonths);
        expect(twice.lower * 2).toBeCloseTo(once.lower, 12);
        expect(twice.upper / once.upper).toBeCloseTo(0.5, 12);
      }),
      runs,
    );
  });

  it('rejects negative or fractional events and no exposure', () => {
    expect(() => poissonRateInterval(-1, 10)).toThrow(/events must be/);
    expect(() => poissonRateInterval(0.5, 10)).toThrow(/events must be a whole number/);
    expect(() => poissonRateInterval(1, 0)).toThrow(/exposure must be/);
    expect(() => poissonRateInterval(1, Number.NaN)).toThrow(/exposure must be/);
  });
});

describe('funnelLimits', () => {
  // Expected counts from 0.1 up; below about 0.025 both limits are 0 (the case after these).
  const rateAndExposure = fc
    .tuple(fc.double({ min: 1e-4, max: 0.2, noNaN: true }), fc.double({ min: 0.1, max: 5_000, noNaN: true }))
    .map(([rate, expectedCount]) => [rate, expectedCount / rate] as const);

  it('surrounds the network rate, leaves at most α/2 of counts past each limit, and widens with confidence', () => {
    fc.assert(
      fc.property(rateAndExposure, ([rate, unitMonths]) => {
        const limits = funnelLimits(rate, unitMonths);
        const mean = rate * unitMonths;
        expect(limits.rate).toBe(rate);
        expect(limits.lower).toBeGreaterThanOrEqual(0);
        expect(limits.lower).toBeLessThanOrEqual(rate);
        expect(limits.upper).toBeGreaterThanOrEqual(rate);
        expect(1 - poissonCdf(Math.ceil(limits.upper * unitMonths - 1e-9), mean)).toBeLessThanOrEqual(0.025 + 1e-12);
        expect(poissonCdf(Math.floor(limits.lower * unitMonths + 1e-9) - 1, mean)).toBeLessThanOrEqual(0.025 + 1e-12);
        const wide = funnelLimits(rate, unitMonths, { confidence: 0.998 });
        expect(wide.lower).toBeLessThanOrEqual(limits.lower);
        expect(wide.upper).toBeGreaterThan(limits.upper);
      }),
      runs,
    );
  });

  it('narrows as exposure grows fourfold', () => {
    fc.assert(
      fc.property(rateAndExposure, ([rate, unitMonths]) => {
        expect(width(funnelLimits(rate, 4 * unitMonths))).toBeLessThan(width(funnelLimits(rate, unitMonths)));
      }),
      runs,
    );
  });

  it('puts the upper limit at 0 where even one event is past the 97.5th percentile of the count', () => {
    expect(funnelLimits(0.001, 10)).toEqual({ rate: 0.001, lower: 0, upper: 0 });
    expect(funnelLimits(0.001, 100).upper).toBeGreaterThan(0);
  });

  it('rejects a network rate or exposure that is not positive', () => {
    expect(() => funnelLimits(0, 100)).toThrow(/networkRate must be/);
    expect(() => funnelLimits(0.01, -5)).toThrow(/exposure must be/);
    expect(() => funnelLimits(0.01, 100, { confidence: 1.2 })).toThrow(/confidence must be/);
  });
});

describe('funnelSide', () => {
  it('puts a count on the same side of the funnel as comparing its rate with funnelLimits', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-4, max: 0.05, noNaN: true }),
        fc.double({ min: 10, max: 200_000, noNaN: true }),
        // Counts near the expected one, where the limits decide: up to four standard deviations either side.
        fc.double({ min: -4, max: 4, noNaN: true }),
        fc.constantFrom(0.95, 0.998),
        (rate, exposure, spread, confidence) => {
          const expected = rate * exposure;
          const events = Math.max(0, Math.round(expected + spread * Math.sqrt(expected)));
          const limits = funnelLimits(rate, exposure, { confidence });
          const observed = events / exposure;
          const side = observed > limits.upper ? 'above' : observed < limits.lower ? 'below' : 'within';
          expect(funnelSide(events, expected, { confidence })).toBe(side);
        },
      ),
      runs,
    );
  });

  it('nests the funnels: a count within the 95 % limits is within the 99.8 %, and one outside the 99.8 % is outside the 95 % on the same side', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 2_000, noNaN: true }), fc.double({ min: -6, max: 6, noNaN: true }), (expected, spread) => {
        const events = Math.max(0, Math.round(expected + spread * Math.sqrt(expected)));
        const [warn, alarm] = [funnelSide(events, expected, { confidence: 0.95 }), funnelSide(events, expected, { confidence: 0.998 })];
        if (warn === 'within') expect(alarm).toBe('within');
        if (alarm !== 'within') expect(warn).toBe(alarm);
      }),
      runs,
    );
  });
});
