import { dcdcInputA, evaluatePlan, moduleTemperatureFactor, type PlanCircuit, type PlanInput } from '@busbar/calc';
import { describe, expect, it } from 'vitest';

const codes = (plan: PlanInput) => evaluatePlan(plan).findings.map((finding) => finding.code);

// Common practice, no source (CHECKS.md): a starter battery recovers only what the alternator puts
// back while driving; a few minutes a day do not refill it.
describe('the starter battery is refilled only by the drive', () => {
  const fridgeWeek = (driveHoursPerDay: number): PlanInput => ({
    systemV: 12,
    gauge: 'awg',
    loads: [{ name: 'Fridge', watts: 40, hoursPerDay: 24, dutyCycle: 0.15 }],
    starterBattery: { capacityAh: 70 },
    trip: { daysParked: 0, daysDriving: 7, driveHoursPerDay, lowestC: 25 },
    circuits: [],
  });

  it('calls for a house battery for a 40 W fridge at 15 % on a 70 Ah starter battery with 6 minutes of driving a day for 7 days', () => {
    // 6 W average = 12 Ah a day; 20 A for 0.1 h puts back about 2 Ah.
    const result = evaluatePlan(fridgeWeek(0.1));
    expect(result.verdict.kind).toBe('bank-needed');
    expect(result.verdict.reasons.join(' ')).toContain('not enough to put back what the loads take');
    expect(result.starterDrawAh).toBeGreaterThan(14);
  });

  it('leaves the verdict to the draw when the drive does refill it', () => {
    const result = evaluatePlan(fridgeWeek(3));
    expect(result.verdict.reasons.join(' ')).toContain('enough to refill it');
  });

  it('never says "no second battery" when the alternator puts back less than the loads take, however small the load', () => {
    for (const watts of [2, 5, 10, 20]) {
      const plan = { ...fridgeWeek(0.02), loads: [{ name: 'Tracker', watts, hoursPerDay: 24 }] };
      expect(evaluatePlan(plan).verdict.kind).not.toBe('no-second-battery');
    }
  });
});

// DC-DC charger input by power balance (CHECKS.md): I_in = V_out × I_out / (η × V_in).
describe('DC-DC charger input current (power balance)', () => {
  it('takes 55.7 A from the starter side for 40 A out at 14.4 V, 90 % efficient, at 11.5 V in', () => {
    expect(dcdcInputA({ outputA: 40, outputV: 14.4, inputV: 11.5, efficiency: 0.9 })).toBeCloseTo(576 / 10.35, 9);
  });

  it('conserves power: what goes in times the efficiency comes out', () => {
    for (const inputV of [11, 12.5, 14]) {
      const inA = dcdcInputA({ outputA: 30, outputV: 14.6, inputV, efficiency: 0.88 });
      expect(inA * inputV * 0.88).toBeCloseTo(30 * 14.6, 9);
    }
  });

  const charging = (alternatorA: number): PlanInput => ({
    systemV: 12,
    gauge: 'awg',
    loads: [{ name: 'Fridge', watts: 45, hoursPerDay: 24, dutyCycle: 0.4 }],
    bank: { chemistry: 'lifepo4', capacityAh: 200 },
    starterBattery: { capacityAh: 70 },
    alternator: { ratedA: alternatorA },
    dcdcCharger: { outputA: 40 },
    trip: { daysParked: 1, daysDriving: 1, driveHoursPerDay: 3 },
    circuits: [
      { from: 'Starter battery', to: 'DC-DC charger', oneWayLengthM: 4, link: 'dcdc-input', critical: true, insulationC: 105, engineSpace: true, fuseFromBatteryMm: 150 },
      { from: 'DC-DC charger', to: 'House battery', oneWayLengthM: 1, link: 'dcdc-output', critical: true, insulationC: 105, fuseToBatteryMm: 150 },
    ],
  });

  it('fills the starter-side circuit at the lowest input voltage and the house side at the output', () => {
    const result = evaluatePlan(charging(220));
    // LiFePO4 charged at 14.4 V; 11.5 V in; 90 % efficient.
    expect(result.dcdcInputA).toBeCloseTo((14.4 * 40) / (0.9 * 11.5), 9);
    expect(result.circuits.map((c) => c.currentA)).toEqual([result.dcdcInputA, 40]);
    expect(result.findings).toEqual([]);
  });

  it("checks the charger's draw with the vehicle's own 30 A against the alternator: close to 90 A warns, over 80 A is critical", () => {
    expect(evaluatePlan(charging(100)).findings.find((f) => f.code === 'alternator-overloaded')).toMatchObject({ severity: 'warning' });
    expect(evaluatePlan(charging(80)).findings.find((f) => f.code === 'alternator-overloaded')).toMatchObject({ severity: 'critical' });
    expect(evaluatePlan(charging(80)).alternatorLoadA).toBeCloseTo((14.4 * 40) / (0.9 * 11.5) + 30, 9);
  });
});

// Source: 33 CFR 183.455(a)–(b) (CHECKS.md [P]): each ungrounded conductor is protected at its
// source, within 7 in (178 mm), or 40 in (1,016 mm) when the conductor is sheathed.
describe('protection at every battery the circuit leaves, 33 CFR 183.455', () => {
  const withCircuits = (circuits: PlanCircuit[], inverter?: PlanInput['inverter']): PlanInput => ({
    systemV: 12,
    gauge: 'awg',
    loads: inverter ? [{ name: 'Laptop', watts: 60, hoursPerDay: 2, activeHours: [19, 20], ac: true }] : [],
    inverter,
    bank: { chemistry: 'lifepo4', capacityAh: 100 },
    starterBattery: { capacityAh: 70 },
    trip: { daysParked: 1, daysDriving: 0, driveHoursPerDay: 0 },
    circuits,
  });
  const feeder: PlanCircuit = { from: 'House battery', to: 'Fuse panel', oneWayLengthM: 1, currentA: 30, critical: true, insulationC: 105, fromBattery: 'house' };

  it('lists the house battery end of a feeder: protected within 178 mm, not at 200 mm', () => {
    const result = evaluatePlan(withCircuits([{ ...feeder, fuseFromBatteryMm: 170 }]));
    expect(result.protectionPoints).toEqual([expect.objectContaining({ circuit: 0, battery: 'house', end: 'from', maxDistanceMm: 178, distanceMm: 170, ok: true })]);
    expect(codes(withCircuits([{ ...feeder, fuseFromBatteryMm: 200 }]))).toEqual(['source-not-protected']);
    expect(codes(withCircuits([feeder]))).toEqual(['source-not-protected']);
  });

  it('allows 1,016 mm (40 in) for a sheathed conductor', () => {
    expect(codes(withCircuits([{ ...feeder, sheathed: true, fuseFromBatteryMm: 900 }]))).toEqual([]);
    expect(codes(withCircuits([{ ...feeder, sheathed: true, fuseFromBatteryMm: 1100 }]))).toEqual(['source-not-protected']);
  });

  it('wants a link between two batteries protected at both ends', () => {
    const link: PlanCircuit = { ...feeder, to: 'Starter battery', toBattery: 'starter', fuseFromBatteryMm: 100 };
    const result = evaluatePlan(withCircuits([link]));
    expect(result.protectionPoints.map((p) => [p.battery, p.ok])).toEqual([
      ['house', true],
      ['starter', false],
    ]);
    expect(codes(withCircuits([{ ...link, fuseToBatteryMm: 100 }]))).toEqual([]);
  });

  it('finds an inverter with no circuit feeding it critical, and sizes the feed from the plan once there is one', () => {
    const inverter = { ratedW: 1500, efficiency: 0.9 };
    expect(evaluatePlan(withCircuits([], inverter)).findings[0]).toMatchObject({ code: 'inverter-feed-missing', severity: 'critical' });
    const feed: PlanCircuit = { from: 'House battery', to: 'Inverter', oneWayLengthM: 1.5, link: 'inverter-feed', critical: true, insulationC: 105, fuseFromBatteryMm: 120 };
    const result = evaluatePlan(withCircuits([feed], inverter));
    expect(codes(withCircuits([feed], inverter))).toEqual([]);
    // 1,500 W / (10.5 V × 0.9) = 158.7 A; its fuse (≥ 198 A) is 200 A, so the wire must carry 200 A.
    expect(result.circuits[0]?.currentA).toBeCloseTo(158.73, 2);
    expect(result.circuits[0]?.fuseA).toBe(200);
    expect(result.circuits[0]?.conductor?.ampacityA).toBeGreaterThanOrEqual(200);
  });
});

// Common practice, no source (CHECKS.md): LiFePO4 must not be charged below about 0 °C unless the
// maker allows it (self-heating banks).
describe('charging lithium in the cold', () => {
  const winter = (lowestC: number, selfHeating?: boolean, bank = true): PlanInput => ({
    systemV: 12,
    gauge: 'awg',
    loads: [{ name: 'Diesel heater', watts: 30, hoursPerDay: 10 }],
    bank: bank ? { chemistry: 'lifepo4', capacityAh: 100, selfHeating } : undefined,
    starterBattery: { capacityAh: 70 },
    dcdcCharger: { outputA: 25 },
    trip: { daysParked: 1, daysDriving: 1, driveHoursPerDay: 4, lowestC, highestC: 5 },
    circuits: [],
  });

  it('finds charging a LiFePO4 bank below 0 °C critical, unless the bank heats itself', () => {
    expect(evaluatePlan(winter(-10)).findings[0]).toMatchObject({ code: 'cold-charging', severity: 'critical' });
    expect(codes(winter(-10, true))).not.toContain('cold-charging');
    expect(codes(winter(2))).not.toContain('cold-charging');
  });

  it('recommends a self-heating bank for a trip below freezing', () => {
    const result = evaluatePlan(winter(-5, undefined, false));
    expect(result.recommendedBank).toMatchObject({ chemistry: 'lifepo4', selfHeating: true });
    expect(result.verdict.headline).toContain('self-heating LiFePO4');
  });
});

// From memory: PVWatts' standard module loses 0.47 % of its power per °C above 25 °C; a module in
// full sun runs about 25 °C above the air.
describe('solar in the heat and through a PWM controller', () => {
  it('takes 0.47 %/°C off a module above 25 °C: at 35 °C air (60 °C module) it gives 83.6 %', () => {
    expect(moduleTemperatureFactor(35)).toBeCloseTo(1 - 0.0047 * 35, 9);
    expect(moduleTemperatureFactor(-10)).toBe(1);
  });

  const solar = (controller: 'mppt' | 'pwm', panelVmp?: number): PlanInput => ({
    systemV: 12,
    gauge: 'awg',
    loads: [{ name: 'Fridge', watts: 45, hoursPerDay: 24, dutyCycle: 0.4 }],
    bank: { chemistry: 'lifepo4', capacityAh: 200 },
    starterBattery: { capacityAh: 70 },
    solar: { arrayW: 200, peakSunHours: 5, controller, panelVmp },
    trip: { daysParked: 3, daysDriving: 0, driveHoursPerDay: 0, highestC: 25 },
    circuits: [],
  });

  it('harvests V_battery / V_mp through PWM (12.8 V on an 18 V panel: 71 %), and warns when the panel is far above the battery', () => {
    const mppt = evaluatePlan(solar('mppt'));
    const pwm = evaluatePlan(solar('pwm'));
    expect(pwm.solarDailyWh / mppt.solarDailyWh).toBeCloseTo(12.8 / 18 / 0.95, 9);
    expect(codes(solar('pwm', 36))).toContain('pwm-panel-mismatch');
    expect(codes(solar('pwm'))).not.toContain('pwm-panel-mismatch');
  });
});

// Common practice, no source: banks and chargers are bought in common sizes, or from the shop's own catalog.
describe('recommendations a shop can buy', () => {
  const needsBank: PlanInput = {
    systemV: 12,
    gauge: 'awg',
    loads: [{ name: 'Fridge', watts: 45, hoursPerDay: 24, dutyCycle: 0.4 }],
    starterBattery: { capacityAh: 70 },
    trip: { daysParked: 3, daysDriving: 1, driveHoursPerDay: 5 },
    circuits: [],
  };

  it('rounds the bank up to a common size, and to the catalog when it has one big enough', () => {
    const common = evaluatePlan(needsBank).recommendedBank;
    expect(common.rule).toBe('common-steps');
    expect([50, 75, 100, 125, 150, 200, 250, 300]).toContain(common.size);
    expect(common.size).toBeGreaterThanOrEqual(common.minimum);
    const stocked = evaluatePlan(needsBank, { stock: { bankAh: { lifepo4: [90, 280, common.minimum + 3] } } }).recommendedBank;
    expect(stocked).toMatchObject({ rule: 'catalog', size: common.minimum + 3 });
    const tooSmall = evaluatePlan(needsBank, { stock: { bankAh: { lifepo4: [common.minimum - 1] } } }).recommendedBank;
    expect(tooSmall.rule).toBe('common-steps');
  });

  it('rounds the charger up likewise, and simulates the bank it recommends', () => {
    const result = evaluatePlan(needsBank);
    expect(result.bank).toMatchObject({ source: 'recommended', ratedAh: result.recommendedBank.size });
    const charger = result.recommendedCharger;
    expect(charger && [10, 20, 25, 30, 40, 50, 60]).toContain(charger?.size);
    expect(evaluatePlan(needsBank, { stock: { chargerA: [charger!.minimum] } }).recommendedCharger).toMatchObject({ rule: 'catalog', size: charger!.minimum });
  });
});
