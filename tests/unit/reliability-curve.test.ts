import { kaplanMeier } from '@busbar/calc';
import { DAYS_PER_MONTH } from '@busbar/shared';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { survivalCurve } from '../../apps/api/src/reliability/survival.ts';

const week = (months: number) => Math.floor((months * DAYS_PER_MONTH + 1e-9) / 7);

describe('the survival curve sent to the screens', () => {
  it('keeps one step per week of service: ten units failing on days 1, 3 and 10', () => {
    // By hand: 10 in service fail 1 on day 1 (0.9), 9 fail 1 on day 3 (0.8), 8 fail 1 on day 10 (0.7).
    const points = survivalCurve([
      { time: 1, failed: true },
      { time: 3, failed: true },
      { time: 10, failed: true },
      { time: 400, failed: false, count: 7 },
    ]);
    expect(points.map((p) => [p.months * DAYS_PER_MONTH, p.atRisk, p.failures])).toEqual([
      [expect.closeTo(3, 9), 10, 2],
      [expect.closeTo(10, 9), 8, 1],
    ]);
    expect(points.map((p) => p.survival)).toEqual([expect.closeTo(0.8, 12), expect.closeTo(0.7, 12)]);
  });

  it('is the Kaplan–Meier curve after each week’s last failure, with the week’s failures and its first units in service', () => {
    const observation = fc.record({ time: fc.integer({ min: 1, max: 2000 }).map((t) => t / 2), failed: fc.boolean(), count: fc.integer({ min: 1, max: 30 }) });
    fc.assert(
      fc.property(fc.array(observation, { minLength: 1, maxLength: 300 }), (observations) => {
        const rows = kaplanMeier(observations);
        const points = survivalCurve(observations);
        expect(new Set(points.map((p) => week(p.months))).size).toBe(points.length);
        expect(points.reduce((sum, p) => sum + p.failures, 0)).toBe(observations.reduce((sum, o) => sum + (o.failed ? o.count : 0), 0));
        for (const point of points) {
          const ofWeek = rows.filter((r) => Math.floor(r.time / 7) === week(point.months));
          const last = ofWeek.at(-1)!;
          expect(point.months).toBeCloseTo(last.time / DAYS_PER_MONTH, 12);
          expect([point.survival, point.lower, point.upper]).toEqual([last.survival, last.lower, last.upper]);
          expect(point.atRisk).toBe(ofWeek[0]!.atRisk);
          expect(point.failures).toBe(ofWeek.reduce((sum, r) => sum + r.events, 0));
        }
      }),
      { seed: 20_261_204, numRuns: 200 },
    );
  });
});
