import { evaluatePlan, type PlanInput } from '@busbar/calc';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';

const runs = { seed: 7_331, numRuns: 150 };

const load = fc
  .record({
    watts: fc.double({ min: 1, max: 400, noNaN: true }),
    share: fc.double({ min: 0, max: 1, noNaN: true }),
    dutyCycle: fc.double({ min: 0.05, max: 1, noNaN: true }),
    activeHours: fc.option(fc.uniqueArray(fc.integer({ min: 0, max: 23 }), { minLength: 1, maxLength: 24 }), { nil: undefined }),
  })
  .map(({ watts, share, dutyCycle, activeHours }) => ({ name: 'load', watts, dutyCycle, activeHours, hoursPerDay: share * (activeHours?.length ?? 24) }));

const plan = fc.record({
  loads: fc.array(load, { minLength: 1, maxLength: 4 }),
  chemistry: fc.constantFrom('lifepo4' as const, 'agm' as const, 'flooded' as const),
  capacityAh: fc.double({ min: 20, max: 400, noNaN: true }),
  arrayW: fc.double({ min: 0, max: 600, noNaN: true }),
  peakSunHours: fc.double({ min: 0, max: 7, noNaN: true }),
  controller: fc.constantFrom('mppt' as const, 'pwm' as const),
  outputA: fc.option(fc.double({ min: 5, max: 80, noNaN: true }), { nil: undefined }),
  daysParked: fc.integer({ min: 0, max: 5 }),
  daysDriving: fc.integer({ min: 1, max: 3 }),
  driveHoursPerDay: fc.double({ min: 0, max: 6, noNaN: true }),
});

type Generated = typeof plan extends fc.Arbitrary<infer T> ? T : never;
const toPlan = (p: Generated, patch: { arrayW?: number; capacityAh?: number } = {}): PlanInput => ({
  systemV: 12,
  gauge: 'awg',
  loads: p.loads,
  bank: { chemistry: p.chemistry, capacityAh: patch.capacityAh ?? p.capacityAh },
  starterBattery: { capacityAh: 70 },
  dcdcCharger: p.outputA === undefined ? undefined : { outputA: p.outputA },
  solar: { arrayW: patch.arrayW ?? p.arrayW, peakSunHours: p.peakSunHours, controller: p.controller },
  trip: { daysParked: p.daysParked, daysDriving: p.daysDriving, driveHoursPerDay: p.driveHoursPerDay },
  circuits: [],
});

describe('state of charge is monotonic in the sources and the bank', () => {
  it('never falls at any hour with more solar', () => {
    fc.assert(
      fc.property(plan, fc.double({ min: 0, max: 600, noNaN: true }), (p, extraW) => {
        const less = evaluatePlan(toPlan(p)).hourly;
        const more = evaluatePlan(toPlan(p, { arrayW: p.arrayW + extraW })).hourly;
        more.forEach((state, i) => expect(state.stateOfChargePercent).toBeGreaterThanOrEqual(less[i]!.stateOfChargePercent - 1e-9));
      }),
      runs,
    );
  });

  it('never holds less charge at any hour with a bigger bank, nor a lower state of charge until the smaller one runs flat', () => {
    fc.assert(
      fc.property(plan, fc.double({ min: 0, max: 400, noNaN: true }), (p, extraAh) => {
        const small = evaluatePlan(toPlan(p)).hourly;
        const big = evaluatePlan(toPlan(p, { capacityAh: p.capacityAh + extraAh })).hourly;
        const flat = small.findIndex((state) => state.storedAh <= 1e-9);
        big.forEach((state, i) => {
          expect(state.storedAh).toBeGreaterThanOrEqual(small[i]!.storedAh - 1e-9);
          if (flat < 0 || i < flat) expect(state.stateOfChargePercent).toBeGreaterThanOrEqual(small[i]!.stateOfChargePercent - 1e-9);
        });
      }),
      runs,
    );
  });

  it('keeps the state of charge between empty and full', () => {
    fc.assert(
      fc.property(plan, (p) => {
        for (const state of evaluatePlan(toPlan(p)).hourly) {
          expect(state.stateOfChargePercent).toBeGreaterThanOrEqual(-1e-9);
          expect(state.stateOfChargePercent).toBeLessThanOrEqual(100 + 1e-9);
        }
      }),
      runs,
    );
  });
});
