import { evaluatePlan, planVerdict, type PlanInput } from '@busbar/calc';
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

const circuitCase = fc.record({
  currentA: fc.double({ min: 0.5, max: 300, noNaN: true }),
  oneWayLengthM: fc.double({ min: 0.2, max: 10, noNaN: true }),
  critical: fc.boolean(),
  insulationC: fc.constantFrom(60 as const, 75 as const, 90 as const, 105 as const),
  engineSpace: fc.boolean(),
  fittedFuseA: fc.option(fc.constantFrom(5, 10, 20, 30, 50, 80, 100, 150, 200, 300), { nil: undefined }),
});

describe('fuses never exceed what protects the wire', () => {
  it('recommends a fuse within the conductor amperage, and calls any fitted fuse above 150 % of it critical', () => {
    fc.assert(
      fc.property(fc.array(circuitCase, { minLength: 1, maxLength: 5 }), (cases) => {
        const plan: PlanInput = {
          systemV: 12,
          gauge: 'awg',
          loads: [],
          starterBattery: { capacityAh: 70 },
          trip: { daysParked: 1, daysDriving: 0, driveHoursPerDay: 0 },
          circuits: cases.map(({ fittedFuseA, ...c }) => ({ from: 'Bus', to: 'Load', ...c, fuseA: fittedFuseA })),
        };
        const result = evaluatePlan(plan);
        result.circuits.forEach((circuit, i) => {
          const fitted = cases[i]!.fittedFuseA;
          if (circuit.recommendedFuseA !== null) expect(circuit.recommendedFuseA).toBeLessThanOrEqual(circuit.conductor!.ampacityA);
          const critical = result.findings.some((f) => f.circuit === i && f.code === 'fuse-does-not-protect-wire');
          if (fitted !== undefined && circuit.conductor) expect(critical).toBe(fitted > 1.5 * circuit.conductor.ampacityA);
        });
      }),
      runs,
    );
  });
});

describe('"no second battery" is never given on weaker assumptions', () => {
  const starterOnly = fc.record({
    watts: fc.double({ min: 1, max: 60, noNaN: true }),
    daysParked: fc.integer({ min: 0, max: 4 }),
    daysDriving: fc.integer({ min: 1, max: 5 }),
    driveHoursPerDay: fc.double({ min: 0, max: 4, noNaN: true }),
    lowestC: fc.integer({ min: -20, max: 30 }),
    lessDriveShare: fc.double({ min: 0, max: 1, noNaN: true }),
    extraW: fc.double({ min: 0, max: 30, noNaN: true }),
  });
  const plan = (watts: number, driveHoursPerDay: number, p: { daysParked: number; daysDriving: number; lowestC: number }): PlanInput => ({
    systemV: 12,
    gauge: 'awg',
    loads: [{ name: 'Load', watts, hoursPerDay: 24, dutyCycle: 0.3 }],
    starterBattery: { capacityAh: 70 },
    trip: { daysParked: p.daysParked, daysDriving: p.daysDriving, driveHoursPerDay, lowestC: p.lowestC },
    circuits: [],
  });
  const noSecond = (input: PlanInput) => evaluatePlan(input).verdict.kind === 'no-second-battery';

  it('with a shorter drive, a bigger load or a colder trip', () => {
    fc.assert(
      fc.property(starterOnly, (p) => {
        const base = noSecond(plan(p.watts, p.driveHoursPerDay, p));
        if (noSecond(plan(p.watts, p.driveHoursPerDay * p.lessDriveShare, p))) expect(base).toBe(true);
        if (noSecond(plan(p.watts + p.extraW, p.driveHoursPerDay, p))) expect(base).toBe(true);
        if (noSecond(plan(p.watts, p.driveHoursPerDay, { ...p, lowestC: p.lowestC - 10 }))) expect(base).toBe(true);
      }),
      { seed: 2_718, numRuns: 120 },
    );
  });
});

describe('the verdict alone', () => {
  it('is the whole evaluation’s verdict', () => {
    fc.assert(
      fc.property(plan, fc.boolean(), (p, withBank) => {
        const input = withBank ? toPlan(p) : { ...toPlan(p), bank: undefined };
        expect(planVerdict(input)).toEqual(evaluatePlan(input).verdict);
      }),
      { seed: 99, numRuns: 60 },
    );
  });
});
