import { evaluatePlan, SAFETY_CAUTION, type PlanCircuit, type PlanInput } from '@busbar/calc';
import { describe, expect, it } from 'vitest';

const codes = (plan: PlanInput) => evaluatePlan(plan).findings.map((finding) => finding.code);

const weekend: PlanInput = {
  systemV: 12,
  gauge: 'awg',
  loads: [{ name: 'LED lights', watts: 10, hoursPerDay: 4, activeHours: [19, 20, 21, 22] }],
  starterBattery: { capacityAh: 70 },
  trip: { daysParked: 2, daysDriving: 1, driveHoursPerDay: 3 },
  circuits: [],
};

describe('a small weekend load', () => {
  const result = evaluatePlan(weekend);

  it('needs no second battery, and says why', () => {
    expect(result.verdict.kind).toBe('no-second-battery');
    expect(result.verdict.headline).toBe('No second battery needed');
    // 10 W × 4 h = 40 Wh = 3.33 Ah each evening. Trips in a row: the evening after the drive, then
    // two parked evenings before the next drive (10.0 Ah); the 3 h drive puts it back. The starter
    // battery holds 88 % of 70 Ah at 10 °C (the default coldest), so it spares 20 % of 61.6 Ah.
    expect(result.dailyWattHours).toBeCloseTo(40, 9);
    expect(result.verdict.reasons.join(' ')).toContain('40 Wh (3.3 Ah) a day');
    expect(result.verdict.reasons.join(' ')).toContain('10.0 Ah, within the 12.3 Ah the 70 Ah starter battery can spare');
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
  it('needs a house battery: 432 + 666.7 + 100 + 126 Wh a day is far past the starter battery', () => {
    const result = evaluatePlan(fourDaysParked);
    // 45 W × 24 h × 0.4 = 432 Wh; 60 W × 10 h / 0.9 = 666.7 Wh; 20 W × 5 h = 100 Wh; the 600 W
    // inverter idling at 1.5 % (9 W) through the terminal's 14 active hours = 126 Wh.
    expect(result.dailyWattHours).toBeCloseTo(432 + 600 / 0.9 + 100 + 9 * 14, 9);
    expect(result.verdict.kind).toBe('bank-needed');
    expect(result.bank.source).toBe('recommended');
    expect(result.recommendedBank.chemistry).toBe('lifepo4');
    expect(result.recommendedBank.size).toBeGreaterThanOrEqual(result.recommendedBank.minimum);
    expect(result.verdict.headline).toContain(`a ${result.recommendedBank.size} Ah LiFePO4 bank (at least ${result.recommendedBank.minimum} Ah`);
  });

  it('empties a 200 Ah lithium bank before the trip ends without solar', () => {
    const result = evaluatePlan({ ...fourDaysParked, bank: lithium200 });
    expect(result.verdict.kind).toBe('bank-too-small');
    expect(result.findings[0]).toMatchObject({ severity: 'critical', code: 'bank-runs-low' });
    expect(result.lowestStateOfChargePercent).toBeLessThan(20);
  });

  it('is carried by a 200 Ah lithium bank with 400 W of solar', () => {
    const feed: PlanCircuit = { from: 'House battery', to: 'Inverter', oneWayLengthM: 1, link: 'inverter-feed', critical: true, insulationC: 105, fuseFromBatteryMm: 150 };
    const result = evaluatePlan({ ...fourDaysParked, bank: lithium200, solar: solar400, circuits: [feed] });
    expect(result.verdict.kind).toBe('bank-ok');
    expect(result.lowestStateOfChargePercent).toBeGreaterThanOrEqual(20);
    expect(result.netDailyAh.parked).toBeGreaterThan(0);
    expect(result.daysOfAutonomyWithCharging).toBeNull();
    expect(result.findings).toEqual([]);
  });

  it('recommends the smallest bank that carries the trip', () => {
    const { minimum } = evaluatePlan(fourDaysParked).recommendedBank;
    expect(codes({ ...fourDaysParked, bank: { chemistry: 'lifepo4', capacityAh: minimum } })).not.toContain('bank-runs-low');
    expect(codes({ ...fourDaysParked, bank: { chemistry: 'lifepo4', capacityAh: minimum - 1 } })).toContain('bank-runs-low');
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
    // 40 A takes a 50 A fuse (≥ 125 %); 12 AWG's 45 A does not cover it, 10 AWG's 60 A does.
    expect(evaluatePlan(plan).circuits[0]?.recommended).toMatchObject({ size: { awg: '10' }, ampacityA: 60, decidedBy: 'ampacity' });
    expect(evaluatePlan(plan).circuits[0]?.recommendedFuseA).toBeNull(); // none fits the fitted 14 AWG
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
    // 10 % of 12 V over 10 m at 4 A needs ≤ 30 mΩ/m: 18 AWG (26.1 mΩ/m) would do, but Busbar
    // recommends no less than 16 AWG (33 CFR 183.425(e)); fuse ≥ 5 A.
    expect(circuit?.conductor?.size).toEqual({ awg: '16' });
    expect(circuit?.recommended?.decidedBy).toBe('minimum');
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
