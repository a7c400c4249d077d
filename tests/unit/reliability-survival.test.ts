import { kaplanMeier, weibullAgeTrend, weibullFit, type SurvivalObservation } from '@busbar/calc';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';

const runs = { seed: 10_011, numRuns: 200 };
const observation = fc.record({ time: fc.integer({ min: 1, max: 60 }), failed: fc.boolean() });
const observations = fc.array(observation, { minLength: 1, maxLength: 80 });

// Uniform draws in (0, 1) from a seeded generator: whole numbers without fast-check's bias towards edge values.
const STEPS = 2 ** 30;
const uniforms = (count: number, seed: number) =>
  fc.sample(fc.noBias(fc.integer({ min: 1, max: STEPS - 1 })), { seed, numRuns: count }).map((k) => k / STEPS);

// Weibull lifetimes by inversion, t = scale · (−ln U)^(1/shape), censored at a fixed age.
function simulate(shape: number, scale: number, censorAt: number, count: number, seed: number): SurvivalObservation[] {
  return uniforms(count, seed).map((u) => {
    const time = scale * (-Math.log(u)) ** (1 / shape);
    return time < censorAt ? { time, failed: true } : { time: censorAt, failed: false };
  });
}

describe('kaplanMeier', () => {
  it('falls step by step within [0, 1], inside its band, with fewer at risk at each later failure time', () => {
    fc.assert(
      fc.property(observations, (units) => {
        const rows = kaplanMeier(units);
        expect(rows.reduce((sum, row) => sum + row.events, 0)).toBe(units.filter((u) => u.failed).length);
        rows.forEach((row, i) => {
          const previous = rows[i - 1];
          expect(row.survival).toBeGreaterThanOrEqual(0);
          expect(row.survival).toBeLessThan(previous?.survival ?? 1);
          expect(row.atRisk).toBeLessThan(previous?.atRisk ?? Infinity);
          expect(row.time).toBeGreaterThan(previous?.time ?? 0);
          expect(row.lower).toBeGreaterThanOrEqual(0);
          expect(row.lower).toBeLessThanOrEqual(row.survival);
          expect(row.upper).toBeGreaterThanOrEqual(row.survival);
          expect(row.upper).toBeLessThanOrEqual(1);
        });
      }),
      runs,
    );
  });

  it('does not depend on the order of the units and widens its band with confidence', () => {
    fc.assert(
      fc.property(observations, (units) => {
        const rows = kaplanMeier(units);
        expect(kaplanMeier([...units].reverse())).toEqual(rows);
        kaplanMeier(units, { confidence: 0.99 }).forEach((wide, i) => {
          expect(wide.lower).toBeLessThanOrEqual(rows[i]!.lower);
          expect(wide.upper).toBeGreaterThanOrEqual(rows[i]!.upper);
        });
      }),
      runs,
    );
  });

  it('equals the share still working when nothing is censored, and ends at 0 with no spread when all failed', () => {
    const times = [3, 5, 5, 8, 12];
    const rows = kaplanMeier(times.map((time) => ({ time, failed: true })));
    expect(rows.map((row) => row.survival)).toEqual([0.8, 0.4, 0.2, 0].map((s) => expect.closeTo(s, 12)));
    expect(rows[3]).toEqual({ time: 12, atRisk: 1, events: 1, survival: 0, standardError: 0, lower: 0, upper: 0 });
  });

  it('counts a unit censored at a failure time as at risk then, and has no rows without failures', () => {
    const rows = kaplanMeier([
      { time: 4, failed: true },
      { time: 4, failed: false },
      { time: 9, failed: false },
    ]);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ time: 4, atRisk: 3, events: 1 });
    expect(rows[0]!.survival).toBeCloseTo(2 / 3, 12);
    expect(kaplanMeier([{ time: 4, failed: false }])).toEqual([]);
  });

  it('rejects no units, times that are not positive and a missing failed flag', () => {
    expect(() => kaplanMeier([])).toThrow(/at least one unit/);
    expect(() => kaplanMeier([{ time: 0, failed: true }])).toThrow(/observations\[0\]\.time must be/);
    expect(() => kaplanMeier([{ time: 2, failed: true }, { time: Number.NaN, failed: false }])).toThrow(/observations\[1\]\.time/);
    expect(() => kaplanMeier([{ time: 2 } as SurvivalObservation])).toThrow(/failed must be true or false/);
  });
});

describe('weibullFit', () => {
  const cases = [
    { shape: 0.7, scale: 40, censorAt: 60, seed: 71 },
    { shape: 1, scale: 120, censorAt: 90, seed: 72 },
    { shape: 2.8, scale: 30, censorAt: 36, seed: 73 },
  ];
  for (const { shape, scale, censorAt, seed } of cases) {
    it(`recovers shape ${shape} and scale ${scale} from 4,000 simulated units censored at ${censorAt}`, () => {
      const fit = weibullFit(simulate(shape, scale, censorAt, 4_000, seed));
      expect(Math.abs(fit.shape / shape - 1)).toBeLessThan(0.05);
      expect(Math.abs(fit.scale / scale - 1)).toBeLessThan(0.05);
    });
  }

  it('keeps the shape and scales the scale when every time is multiplied', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1_000 }), fc.double({ min: 1e-3, max: 1e4, noNaN: true }), (seed, factor) => {
        const units = simulate(1.6, 50, 70, 60, seed);
        const fit = weibullFit(units);
        const scaled = weibullFit(units.map((u) => ({ ...u, time: u.time * factor })));
        expect(scaled.shape).toBeCloseTo(fit.shape, 8);
        expect(scaled.scale / (fit.scale * factor)).toBeCloseTo(1, 8);
      }),
      { seed: 10_012, numRuns: 50 },
    );
  });

  it('asks for failures at two distinct times', () => {
    const censored = { time: 50, failed: false };
    expect(() => weibullFit([censored])).toThrow(/needs failures at 2 or more distinct times .*; got 0/);
    expect(() => weibullFit([{ time: 10, failed: true }, censored])).toThrow(/got 1/);
    expect(() => weibullFit([{ time: 10, failed: true }, { time: 10, failed: true }, censored])).toThrow(/got 1/);
    expect(weibullFit([{ time: 10, failed: true }, { time: 20, failed: true }, censored]).shape).toBeGreaterThan(0);
  });

  it('rejects no units and times that are not positive', () => {
    expect(() => weibullFit([])).toThrow(/at least one unit/);
    expect(() => weibullFit([{ time: -3, failed: true }])).toThrow(/observations\[0\]\.time must be/);
  });
});

describe('grouped observations', () => {
  // A group of `count` units sharing a time and outcome must weigh exactly as many single units.
  const groups = fc.array(fc.record({ time: fc.integer({ min: 1, max: 60 }), failed: fc.boolean(), count: fc.integer({ min: 1, max: 6 }) }), {
    minLength: 1,
    maxLength: 30,
  });
  const expand = (grouped: SurvivalObservation[]) => grouped.flatMap(({ time, failed, count = 1 }) => Array.from({ length: count }, () => ({ time, failed })));

  it('give the Kaplan–Meier curve of the same units one by one', () => {
    fc.assert(
      fc.property(groups, (grouped) => {
        const single = kaplanMeier(expand(grouped));
        kaplanMeier(grouped).forEach((row, i) => {
          expect(row.atRisk).toBe(single[i]!.atRisk);
          expect(row.events).toBe(single[i]!.events);
          expect(row.survival).toBeCloseTo(single[i]!.survival, 12);
          expect(row.lower).toBeCloseTo(single[i]!.lower, 12);
        });
      }),
      runs,
    );
  });

  it('give the Weibull fit of the same units one by one', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1_000 }), (seed) => {
        const units = simulate(1.3, 30, 40, 80, seed).map((u) => ({ ...u, time: Math.ceil(u.time) }));
        const groups = new Map<string, SurvivalObservation>();
        for (const u of units) {
          const group = groups.get(`${u.time}:${u.failed}`);
          if (group) group.count = (group.count ?? 1) + 1;
          else groups.set(`${u.time}:${u.failed}`, { ...u, count: 1 });
        }
        const grouped = [...groups.values()];
        const fit = weibullFit(units);
        const groupedFit = weibullFit(grouped);
        expect(groupedFit.shape).toBeCloseTo(fit.shape, 9);
        expect(groupedFit.scale).toBeCloseTo(fit.scale, 7);
        expect(groupedFit.logLikelihood).toBeCloseTo(fit.logLikelihood, 7);
      }),
      { seed: 10_013, numRuns: 40 },
    );
  });

  it('refuse a count that is not a whole number of 1 or more', () => {
    expect(() => kaplanMeier([{ time: 2, failed: true, count: 0 }])).toThrow(/observations\[0\]\.count must be a whole number/);
    expect(() => weibullFit([{ time: 2, failed: true, count: 1.5 }])).toThrow(/count must be a whole number/);
  });
});

describe('weibullAgeTrend', () => {
  it('reads early failures and wear-out from 600 simulated units, and a steady rate from exponential ones', () => {
    expect(weibullAgeTrend(simulate(0.6, 40, 60, 600, 81)).trend).toBe('early');
    expect(weibullAgeTrend(simulate(2.2, 40, 60, 600, 82)).trend).toBe('wear_out');
    expect(weibullAgeTrend(simulate(1, 40, 60, 600, 83)).trend).toBe('steady');
  });

  it('calls a steady rate early or wear-out in about one sample in twenty at 95 %', () => {
    const samples = 300;
    const calls = Array.from({ length: samples }, (_, i) => weibullAgeTrend(simulate(1, 50, 40, 120, 1_000 + i))).filter((t) => t.trend !== 'steady').length;
    // Binomial(300, 0.05): mean 15, sd 3.8; between 4 and 30 holds with far more than 99 % chance.
    expect(calls).toBeGreaterThan(4);
    expect(calls).toBeLessThan(30);
  });
});
