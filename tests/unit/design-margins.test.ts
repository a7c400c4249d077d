import { designMargins, evaluatePlan, MARGIN_BAND_BOUNDS, marginBand, type Awg, type PlanCircuit, type PlanInput } from '@busbar/calc';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { feeder, feederPlan } from '../support/margin-plans.ts';

const runs = { seed: 4_217, numRuns: 120 };

const plan = feederPlan;
const margins = (input: PlanInput) => designMargins(evaluatePlan(input));
const withCircuit = (patch: Partial<PlanCircuit>, base: PlanInput = plan): PlanInput => ({ ...base, circuits: [{ ...feeder, ...patch }] });

describe('design margins of a plan', () => {
  it('reads the tightest drop and load against their limits and the deepest discharge of the house bank', () => {
    const m = margins(plan)!;
    expect(m.dropShare).toBeCloseTo((20 * 6 * 0.778) / 304.8 / 12 / 0.03, 3);
    expect(m.loadShare).toBeCloseTo(20 / 80, 9);
    expect(m.deepestDischargePercent).toBeGreaterThan(5);
    expect(m.deepestDischargePercent).toBeLessThan(10);
    expect([m.dropBand, m.loadBand, m.dischargeBand]).toEqual([3, 1, 1]);
  });

  it('puts a feeder over its allowed drop in band 4, and takes the tightest of several circuits', () => {
    expect(margins(withCircuit({ size: { awg: '10' } }))!.dropBand).toBe(4);
    const lights: PlanCircuit = { from: 'Fuse block', to: 'Lights', oneWayLengthM: 2, currentA: 2, critical: false, insulationC: 105, size: { awg: '14' } };
    const both = margins({ ...plan, circuits: [lights, feeder] })!;
    expect(both.dropShare).toBeCloseTo(margins(plan)!.dropShare, 12);
    expect(margins({ ...plan, circuits: [lights] })!.dropBand).toBe(1);
  });

  it('puts an overloaded conductor in load band 4 and one at 80 % of its amperage in band 3', () => {
    // 14 AWG carries 35 A at 105 °C.
    const overloaded = margins(withCircuit({ size: { awg: '14' }, currentA: 60, oneWayLengthM: 0.3 }))!;
    expect(overloaded.loadShare).toBeCloseTo(60 / 35, 9);
    expect(overloaded.loadBand).toBe(4);
    expect(margins(withCircuit({ size: { awg: '14' }, currentA: 28, oneWayLengthM: 0.3 }))!.loadBand).toBe(3);
  });

  it('counts a circuit no conductor fits as past both limits', () => {
    const m = margins(withCircuit({ size: undefined, currentA: 900, oneWayLengthM: 30 }))!;
    expect([m.dropShare, m.loadShare, m.dropBand, m.loadBand]).toEqual([Infinity, Infinity, 4, 4]);
  });

  it('puts a bank drawn past 80 % in discharge band 4', () => {
    const heavy = { ...plan, loads: [{ name: 'Fridge', watts: 60, hoursPerDay: 24 }], trip: { daysParked: 3, daysDriving: 1, driveHoursPerDay: 1 } };
    const m = margins(heavy)!;
    expect(m.deepestDischargePercent).toBeGreaterThan(80);
    expect(m.dischargeBand).toBe(4);
  });

  it('answers null for a plan without circuits or without a planned house bank: the build counts as having no plan', () => {
    expect(margins({ ...plan, circuits: [] })).toBeNull();
    expect(margins({ ...plan, bank: undefined })).toBeNull();
  });

  it('ends each band at its bound: the lower bounds start the next band, the limit itself is still within', () => {
    const { drop, discharge } = MARGIN_BAND_BOUNDS;
    expect([0, 0.4999, 0.5, 0.7999, 0.8, 1, 1.0001, Infinity].map((x) => marginBand(x, drop))).toEqual([1, 1, 2, 2, 3, 3, 4, 4]);
    expect([0, 29.99, 30, 49.99, 50, 80, 80.01, 100].map((x) => marginBand(x, discharge))).toEqual([1, 1, 2, 2, 3, 3, 4, 4]);
  });
});

const gauges: Awg[] = ['14', '12', '10', '8', '6', '4', '2', '1/0', '2/0'];
const circuitCase = fc.record({
  awg: fc.constantFrom(...gauges),
  currentA: fc.double({ min: 1, max: 300, noNaN: true }),
  oneWayLengthM: fc.double({ min: 0.2, max: 12, noNaN: true }),
  extra: fc.double({ min: 0, max: 12, noNaN: true }),
  critical: fc.boolean(),
  insulationC: fc.constantFrom(60 as const, 75 as const, 90 as const, 105 as const),
  engineSpace: fc.boolean(),
});
type Case = typeof circuitCase extends fc.Arbitrary<infer T> ? T : never;
const caseCircuit = (c: Case, patch: Partial<PlanCircuit> = {}): PlanInput =>
  withCircuit({ size: { awg: c.awg }, currentA: c.currentA, oneWayLengthM: c.oneWayLengthM, critical: c.critical, insulationC: c.insulationC, engineSpace: c.engineSpace, ...patch });

describe('design margins, properties', () => {
  it('never gives a longer run of the same conductor a lower drop band, nor a different load band', () => {
    fc.assert(
      fc.property(circuitCase, (c) => {
        const short = margins(caseCircuit(c))!;
        const long = margins(caseCircuit(c, { oneWayLengthM: c.oneWayLengthM + c.extra }))!;
        expect(long.dropBand).toBeGreaterThanOrEqual(short.dropBand);
        expect(long.loadBand).toBe(short.loadBand);
      }),
      runs,
    );
  });

  it('never gives more current in the same conductor a lower drop or load band', () => {
    fc.assert(
      fc.property(circuitCase, (c) => {
        const less = margins(caseCircuit(c))!;
        const more = margins(caseCircuit(c, { currentA: c.currentA * (1 + c.extra / 4) }))!;
        expect(more.dropBand).toBeGreaterThanOrEqual(less.dropBand);
        expect(more.loadBand).toBeGreaterThanOrEqual(less.loadBand);
      }),
      runs,
    );
  });

  it('reports band 4 exactly when the plan finds the conductor over its drop or its amperage', () => {
    fc.assert(
      fc.property(circuitCase, (c) => {
        const result = evaluatePlan(caseCircuit(c));
        const codes = result.findings.map((f) => f.code);
        const m = designMargins(result)!;
        expect(m.dropBand === 4).toBe(codes.includes('circuit-over-drop'));
        expect(m.loadBand === 4).toBe(codes.includes('conductor-over-ampacity'));
      }),
      runs,
    );
  });

  it('never gives a bigger house bank a higher discharge band on the same trip', () => {
    const trip = fc.record({
      watts: fc.double({ min: 5, max: 120, noNaN: true }),
      capacityAh: fc.double({ min: 30, max: 300, noNaN: true }),
      extraAh: fc.double({ min: 0, max: 300, noNaN: true }),
      chemistry: fc.constantFrom('lifepo4' as const, 'agm' as const, 'flooded' as const),
      daysParked: fc.integer({ min: 0, max: 4 }),
    });
    fc.assert(
      fc.property(trip, (t) => {
        const at = (capacityAh: number) =>
          margins({ ...plan, loads: [{ name: 'Fridge', watts: t.watts, hoursPerDay: 24 }], bank: { chemistry: t.chemistry, capacityAh }, trip: { ...plan.trip, daysParked: t.daysParked } })!;
        expect(at(t.capacityAh + t.extraAh).dischargeBand).toBeLessThanOrEqual(at(t.capacityAh).dischargeBand);
      }),
      { ...runs, numRuns: 60 },
    );
  });
});
