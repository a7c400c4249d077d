import { evaluatePlan, SAFETY_CAUTION, type PlanCircuit, type PlanInput } from '@busbar/calc';
import { describe, expect, it } from 'vitest';

const codes = (plan: PlanInput) => evaluatePlan(plan).findings.map((finding) => finding.code);

const weekend: PlanInput = {
  systemV: 12,
  gauge: 'awg',
  loads: [
    { name: 'LED lights', watts: 10, hoursPerDay: 4, activeHours: [19, 20, 21, 22] },
    { name: 'Phone charging', watts: 10, hoursPerDay: 2 },
  ],
  starterBattery: { capacityAh: 70 },
  trip: { daysParked: 2, daysDriving: 1, driveHoursPerDay: 3 },
  circuits: [],
};

describe('a small weekend load', () => {
  const result = evaluatePlan(weekend);

  it('needs no second battery, and says why', () => {
    expect(result.verdict.kind).toBe('no-second-battery');
    expect(result.verdict.headline).toBe('No second battery needed');
    // 10 W × 4 h + 10 W × 2 h = 60 Wh = 5 Ah a day. Deepest draw: two parked days (10 Ah) and the
    // phone's share of 00:00–09:00 on the driving day (20 Wh / 24 h × 9 h = 7.5 Wh, 0.625 Ah).
    expect(result.dailyWattHours).toBeCloseTo(60, 9);
    expect(result.verdict.reasons.join(' ')).toContain('60 Wh (5.0 Ah) a day');
    expect(result.verdict.reasons.join(' ')).toContain('10.6 Ah, within the 14.0 Ah the 70 Ah starter battery can spare');
    expect(result.bank.source).toBe('starter');
    expect(result.findings).toEqual([]);
  });

  it('carries the safety caution', () => {
    expect(result.caution).toBe(SAFETY_CAUTION);
    expect(SAFETY_CAUTION).toMatch(/makers' instructions, local codes and a qualified installer/);
  });

  it('calls for a house battery once a load runs through an inverter', () => {
    const withAc = { ...weekend, inverter: { ratedW: 300, efficiency: 0.9 }, loads: [...weekend.loads, { name: 'Laptop', watts: 45, hoursPerDay: 1, ac: true }] };
    const verdict = evaluatePlan(withAc).verdict;
    expect(verdict.kind).toBe('bank-needed');
    expect(verdict.reasons.join(' ')).toContain('inverter');
  });
});

const fourDaysParked: PlanInput = {
  systemV: 12,
  gauge: 'awg',
  loads: [
    { name: 'Fridge', watts: 45, hoursPerDay: 24, dutyCycle: 0.4 },
    { name: 'Satellite internet terminal', watts: 60, hoursPerDay: 10, activeHours: [8, 9, 10, 11, 12, 13, 14, 15, 16, 17, 18, 19, 20, 21], ac: true },
    { name: 'Lights', watts: 20, hoursPerDay: 5, activeHours: [18, 19, 20, 21, 22] },
  ],
  inverter: { ratedW: 600, efficiency: 0.9 },
  starterBattery: { capacityAh: 70 },
  dcdcCharger: { outputA: 40 },
  trip: { daysParked: 4, daysDriving: 1, driveHoursPerDay: 4 },
  circuits: [],
};
const lithium200 = { chemistry: 'lifepo4' as const, capacityAh: 200 };
const solar400 = { arrayW: 400, peakSunHours: 5, controller: 'mppt' as const };

describe('fridge, satellite internet terminal and lights for four days parked', () => {
  it('needs a house battery: 432 + 666.7 + 100 Wh a day is far past the starter battery', () => {
    const result = evaluatePlan(fourDaysParked);
    // 45 W × 24 h × 0.4 = 432 Wh; 60 W × 10 h / 0.9 = 666.7 Wh; 20 W × 5 h = 100 Wh.
    expect(result.dailyWattHours).toBeCloseTo(432 + 600 / 0.9 + 100, 9);
    expect(result.verdict.kind).toBe('bank-needed');
    expect(result.bank.source).toBe('recommended');
    expect(result.recommendedBankChemistry).toBe('lifepo4');
    expect(result.verdict.headline).toContain(`at least ${result.recommendedBankAh} Ah LiFePO4`);
  });

  it('empties a 200 Ah lithium bank before the trip ends without solar', () => {
    const result = evaluatePlan({ ...fourDaysParked, bank: lithium200 });
    expect(result.verdict.kind).toBe('bank-too-small');
    expect(result.findings[0]).toMatchObject({ severity: 'critical', code: 'bank-runs-low' });
    expect(result.lowestStateOfChargePercent).toBeLessThan(20);
  });

  it('is carried by a 200 Ah lithium bank with 400 W of solar', () => {
    const result = evaluatePlan({ ...fourDaysParked, bank: lithium200, solar: solar400 });
    expect(result.verdict.kind).toBe('bank-ok');
    expect(result.lowestStateOfChargePercent).toBeGreaterThanOrEqual(20);
    expect(result.netDailyAh.parked).toBeGreaterThan(0);
    expect(result.daysOfAutonomyWithCharging).toBeNull();
    expect(result.findings).toEqual([]);
  });

  it('recommends the smallest bank that carries the trip', () => {
    const { recommendedBankAh } = evaluatePlan(fourDaysParked);
    expect(codes({ ...fourDaysParked, bank: { chemistry: 'lifepo4', capacityAh: recommendedBankAh } })).not.toContain('bank-runs-low');
    expect(codes({ ...fourDaysParked, bank: { chemistry: 'lifepo4', capacityAh: recommendedBankAh - 2 } })).toContain('bank-runs-low');
  });

  it('lays the trip out hour by hour: four parked days, then the driving day', () => {
    const { hourly } = evaluatePlan({ ...fourDaysParked, bank: lithium200, solar: solar400 });
    expect(hourly).toHaveLength(5 * 24);
    expect(hourly.filter((h) => h.kind === 'parked')).toHaveLength(4 * 24);
    expect(hourly.at(-1)).toMatchObject({ day: 5, hour: 23, kind: 'driving' });
  });
});

const circuitPlan = (circuits: PlanCircuit[]): PlanInput => ({ ...weekend, circuits });

describe('circuits', () => {
  it('flags a conductor that cannot carry its current: 14 AWG at 105 °C is allowed 35 A, not 40 A', () => {
    const plan = circuitPlan([{ from: 'Fuse panel', to: 'Compressor', oneWayLengthM: 1, currentA: 40, critical: false, insulationC: 105, size: { awg: '14' } }]);
    const finding = evaluatePlan(plan).findings.find((f) => f.code === 'conductor-over-ampacity');
    expect(finding).toMatchObject({ severity: 'critical', circuit: 0 });
    // 12 AWG is allowed 45 A and drops 40 A × 2 m × 6.50 mΩ/m = 0.52 V (4.3 %), within 10 %.
    expect(evaluatePlan(plan).circuits[0]?.recommended).toMatchObject({ size: { awg: '12' }, ampacityA: 45, decidedBy: 'ampacity' });
  });

  it('flags a circuit over its allowed drop: 20 A over 3 m of 12 AWG drops 6.5 %, over the 3 % for a critical circuit', () => {
    const plan = circuitPlan([{ from: 'House battery', to: 'Fuse panel', oneWayLengthM: 3, currentA: 20, critical: true, insulationC: 105, size: { awg: '12' } }]);
    const result = evaluatePlan(plan);
    expect(result.circuits[0]?.conductor?.dropPercent).toBeCloseTo((100 * 20 * 6 * (1.98 / 304.8)) / 12, 9);
    expect(result.findings).toEqual([expect.objectContaining({ severity: 'warning', code: 'circuit-over-drop', circuit: 0 })]);
    // 3 % of 12 V over 6 m at 20 A needs ≤ 3.0 mΩ/m (0.914 Ω/kft): 8 AWG (0.778).
    expect(result.circuits[0]?.recommended?.size).toEqual({ awg: '8' });
  });

  it('flags a fuse that does not protect its wire: 40 A on 16 AWG (25 A at 105 °C, so at most 37.5 A)', () => {
    const plan = circuitPlan([{ from: 'Fuse panel', to: 'Fridge', oneWayLengthM: 4, currentA: 6, critical: false, insulationC: 105, size: { awg: '16' }, fuseA: 40 }]);
    const result = evaluatePlan(plan);
    expect(result.findings).toEqual([expect.objectContaining({ severity: 'critical', code: 'fuse-does-not-protect-wire', circuit: 0 })]);
    expect(result.circuits[0]?.fuseA).toBe(40);
    expect(result.circuits[0]?.recommendedFuseA).toBe(7.5); // smallest standard rating ≥ 7.5 A (125 % of 6 A)
  });

  it('warns of a fuse below 125 % of its load', () => {
    const plan = circuitPlan([{ from: 'Fuse panel', to: 'Fridge', oneWayLengthM: 4, currentA: 6, critical: false, insulationC: 105, size: { awg: '16' }, fuseA: 7 }]);
    expect(codes(plan)).toEqual(['fuse-below-load']);
  });

  it('ranks critical findings before warnings', () => {
    const plan = circuitPlan([
      { from: 'House battery', to: 'Fuse panel', oneWayLengthM: 3, currentA: 20, critical: true, insulationC: 105, size: { awg: '12' } },
      { from: 'Fuse panel', to: 'Fridge', oneWayLengthM: 4, currentA: 6, critical: false, insulationC: 105, size: { awg: '16' }, fuseA: 40 },
    ]);
    expect(evaluatePlan(plan).findings.map((f) => [f.severity, f.circuit])).toEqual([['critical', 1], ['warning', 0]]);
  });

  it('chooses conductor and fuse when none is fitted', () => {
    const plan = circuitPlan([{ from: 'Fuse panel', to: 'Lights', oneWayLengthM: 5, currentA: 4, critical: false, insulationC: 105 }]);
    const [circuit] = evaluatePlan(plan).circuits;
    // 10 % of 12 V over 10 m at 4 A needs ≤ 30 mΩ/m: 18 AWG (26.1 mΩ/m), allowed 20 A; fuse ≥ 5 A.
    expect(circuit?.conductor?.size).toEqual({ awg: '18' });
    expect(circuit?.fuseA).toBe(5);
  });
});

describe('bad inputs', () => {
  it('are rejected with the field named', () => {
    expect(() => evaluatePlan({ ...weekend, loads: [{ name: 'x', watts: -5, hoursPerDay: 1 }] })).toThrow(/loads\[0\]\.watts/);
    expect(() => evaluatePlan({ ...weekend, starterBattery: { capacityAh: Number.NaN } })).toThrow(/starterBattery\.capacityAh/);
    expect(() => evaluatePlan({ ...weekend, trip: { daysParked: 0, daysDriving: 0, driveHoursPerDay: 0 } })).toThrow(/trip/);
    expect(() => evaluatePlan({ ...weekend, trip: { daysParked: 1.5, daysDriving: 0, driveHoursPerDay: 0 } })).toThrow(/trip\.daysParked/);
    expect(() => evaluatePlan({ ...weekend, bank: { chemistry: 'lifepo4', capacityAh: 0 } })).toThrow(/bank\.capacityAh/);
    expect(() => evaluatePlan({ ...weekend, bank: { chemistry: 'nicad' as 'agm', capacityAh: 100 } })).toThrow(/bank\.chemistry/);
    expect(() => evaluatePlan(circuitPlan([{ from: 'a', to: 'b', oneWayLengthM: 2, currentA: 5, critical: false, insulationC: 105, size: { awg: '7' as '8' } }]))).toThrow(/circuits\[0\]\.size\.awg/);
    expect(() => evaluatePlan({ ...weekend, loads: [{ name: 'Laptop', watts: 45, hoursPerDay: 2, ac: true }] })).toThrow(/inverter/);
    expect(() => evaluatePlan({ ...weekend, loads: [{ name: 'Lights', watts: 10, hoursPerDay: 5, activeHours: [20, 21] }] })).toThrow(/loads\[0\]\.hoursPerDay/);
  });
});
