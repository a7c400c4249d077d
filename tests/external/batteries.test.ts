import {
  bankNominalV,
  BATTERY_CHEMISTRIES,
  evaluatePlan,
  hoursToRefill,
  inverterInputA,
  peukertRuntimeH,
  type PlanInput,
} from '@busbar/calc';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';

// Source: electrotechnik.net (2010), Peukert's law t = C / I^k: 100 Ah, k = 1.2, 5 A → 14.5 h
// (CHECKS.md [P]). That form takes C as the capacity at a 1 A discharge; Busbar's
// t = H × (C / (I × H))^k reduces to it when the rating is at 1 A, i.e. H = C / 1 A hours.
describe("Peukert's law", () => {
  it('gives 14.5 h for 100 Ah, k = 1.2 at 5 A with the capacity stated at 1 A (electrotechnik.net 2010)', () => {
    expect(peukertRuntimeH({ capacityAh: 100, ratedHours: 100, currentA: 5, exponent: 1.2 })).toBeCloseTo(14.5, 1);
  });

  it('matches t = C / I^k for any capacity stated at 1 A (electrotechnik.net 2010)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 1000, noNaN: true }), fc.double({ min: 0.1, max: 200, noNaN: true }), fc.double({ min: 1, max: 1.6, noNaN: true }), (capacityAh, currentA, exponent) => {
        const runtimeH = peukertRuntimeH({ capacityAh, ratedHours: capacityAh, currentA, exponent });
        expect(runtimeH / (capacityAh / currentA ** exponent)).toBeCloseTo(1, 9);
      }),
      { seed: 4101 },
    );
  });

  it('gives a 100 Ah battery rated at 20 h exactly 20 h at its 20-hour current of 5 A, not 14.5 h (definition of the rating)', () => {
    expect(peukertRuntimeH({ capacityAh: 100, ratedHours: 20, currentA: 5, exponent: 1.2 })).toBeCloseTo(20, 9);
  });
});

// From memory (CHECKS.md [M]): lead-acid 2.0 V per cell, planned at 50 % depth of discharge;
// LiFePO4 3.2 V per cell, 12.8 V for four in series, 80–100 % usable.
describe('battery chemistries (from memory)', () => {
  it('has lead-acid at 2.0 V per cell, 12.0 V for six, planned at 50 %', () => {
    for (const chemistry of ['agm', 'flooded'] as const) {
      expect(BATTERY_CHEMISTRIES[chemistry].cellV).toBe(2);
      expect(bankNominalV(chemistry, 12)).toBeCloseTo(12, 9);
      expect(BATTERY_CHEMISTRIES[chemistry].defaultDepthOfDischarge).toBe(0.5);
    }
  });

  const lightDraw = (bank: PlanInput['bank']): PlanInput => ({
    systemV: 12,
    gauge: 'awg',
    loads: [{ name: 'Router', watts: 12, hoursPerDay: 24 }],
    bank,
    starterBattery: { capacityAh: 70 },
    trip: { daysParked: 1, daysDriving: 0, driveHoursPerDay: 0, lowestC: 25 },
    circuits: [],
  });

  it('has LiFePO4 at 3.2 V per cell, 12.8 V for four in series, planned at 80 %, the low end of 80–100 %', () => {
    expect(BATTERY_CHEMISTRIES.lifepo4.cellV).toBe(3.2);
    expect(bankNominalV('lifepo4', 12)).toBeCloseTo(12.8, 9);
    expect(bankNominalV('lifepo4', 24)).toBeCloseTo(25.6, 9);
    const { bank } = evaluatePlan(lightDraw({ chemistry: 'lifepo4', capacityAh: 100 }));
    expect(bank.usableAh).toBeCloseTo(80, 9);
    expect(bank.floorPercent).toBeCloseTo(20, 9);
  });

  it('plans a lead-acid bank at half its rating at a light draw', () => {
    expect(evaluatePlan(lightDraw({ chemistry: 'agm', capacityAh: 200 })).bank.usableAh).toBeCloseTo(100, 9);
  });

  it('has lead-acid hold about 80 % of its rating at 0 °C and well under 70 % at −20 °C (from memory)', () => {
    const at = (lowestC: number) => evaluatePlan({ ...lightDraw({ chemistry: 'flooded', capacityAh: 100 }), trip: { daysParked: 1, daysDriving: 0, driveHoursPerDay: 0, lowestC } }).bank;
    expect(at(0).effectiveCapacityAh).toBeCloseTo(80, 0);
    expect(at(-20).effectiveCapacityAh).toBeLessThan(70);
    expect(at(-20).effectiveCapacityAh).toBeGreaterThan(50);
  });
});

const dailyUse = (outputA: number): PlanInput => ({
  systemV: 12,
  gauge: 'awg',
  // 50 W × 24 h × 0.5 = 600 Wh and 60 W × 7 h = 420 Wh: 1,020 Wh, 85 Ah a day.
  loads: [
    { name: 'Fridge', watts: 50, hoursPerDay: 24, dutyCycle: 0.5 },
    { name: 'Laptop and lights', watts: 60, hoursPerDay: 7, activeHours: [12, 13, 14, 15, 16, 17, 18, 19, 20, 21, 22] },
  ],
  bank: { chemistry: 'lifepo4', capacityAh: 125 },
  starterBattery: { capacityAh: 70 },
  dcdcCharger: { outputA },
  trip: { daysParked: 0, daysDriving: 7, driveHoursPerDay: 2.5 },
  circuits: [],
});

describe('charging a lithium house bank while driving (common practice, no source)', () => {
  it('refills a 125 Ah lithium bank with a 50 A DC-DC charger in about 2.5 hours of driving', () => {
    const chargeEfficiency = BATTERY_CHEMISTRIES.lifepo4.chargeEfficiency;
    for (const refillAh of [100, 125]) {
      const hours = hoursToRefill({ refillAh, chargerA: 50, chargeEfficiency });
      expect(hours).toBeGreaterThan(2);
      expect(hours).toBeLessThan(3);
    }
  });

  it('calls a 25 A charger too small for a 125 Ah lithium bank used daily, and a 50 A one enough', () => {
    const small = evaluatePlan(dailyUse(25));
    expect(small.findings.map((f) => f.code)).toContain('charger-undersized');
    expect(small.recommendedCharger?.minimum).toBeGreaterThan(25);
    expect(small.recommendedCharger?.size).toBeLessThanOrEqual(50);
    const enough = evaluatePlan(dailyUse(50));
    expect(enough.findings.map((f) => f.code)).not.toContain('charger-undersized');
    expect(enough.verdict.kind).toBe('bank-ok');
  });

  it('wants a lithium charger of roughly 0.2–0.5 C', () => {
    expect(BATTERY_CHEMISTRIES.lifepo4.chargeRateC).toEqual({ min: 0.2, max: 0.5 });
    const big = evaluatePlan(dailyUse(80)); // 80 A on 125 Ah is 0.64 C
    expect(big.findings.map((f) => f.code)).toContain('charger-above-bank-rate');
  });
});

describe('inverter input current (common practice, no source)', () => {
  it('has a 1,000 W inverter draw roughly 90–100 A at 12 V at full load', () => {
    for (const efficiency of [0.85, 0.9, 0.92]) {
      const currentA = inverterInputA({ acW: 1000, batteryV: 12, efficiency });
      expect(currentA).toBeGreaterThanOrEqual(90);
      expect(currentA).toBeLessThanOrEqual(100);
    }
  });

  it('sizes the inverter feed at the cutoff (about 10.5 V, from memory), where it draws more than 100 A', () => {
    const plan: PlanInput = {
      systemV: 12,
      gauge: 'awg',
      loads: [{ name: 'Kettle', watts: 900, hoursPerDay: 0.1, activeHours: [7], ac: true }],
      inverter: { ratedW: 1000, efficiency: 0.9 },
      bank: { chemistry: 'lifepo4', capacityAh: 200 },
      starterBattery: { capacityAh: 70 },
      trip: { daysParked: 1, daysDriving: 0, driveHoursPerDay: 0 },
      circuits: [{ from: 'House battery', to: 'Inverter', oneWayLengthM: 1, link: 'inverter-feed', critical: true, insulationC: 105, fuseFromBatteryMm: 100 }],
    };
    const result = evaluatePlan(plan);
    expect(result.inverterInputA).toBeCloseTo(1000 / (10.5 * 0.9), 9); // 105.8 A
    expect(result.inverterInputA).toBeGreaterThan(100);
    expect(result.circuits[0]?.currentA).toBe(result.inverterInputA);
    // 24 V systems cut off at 21 V.
    expect(evaluatePlan({ ...plan, systemV: 24 }).inverterInputA).toBeCloseTo(1000 / (21 * 0.9), 9);
  });
});

// Source: electrotechnik.net (2010), t = C / I^k (CHECKS.md [P]), applied at the current drawn in
// each hour rather than the day's average.
describe("Peukert's law at each hour's current", () => {
  const agm = (loads: PlanInput['loads'], inverter?: PlanInput['inverter']): PlanInput => ({
    systemV: 12,
    gauge: 'awg',
    loads,
    inverter,
    bank: { chemistry: 'agm', capacityAh: 200 },
    starterBattery: { capacityAh: 70 },
    trip: { daysParked: 1, daysDriving: 0, driveHoursPerDay: 0, lowestC: 25 },
    circuits: [],
  });

  it('runs a 100 Ah bank stated at 1 A (k = 1.2) flat after 14.5 h of a steady 5 A', () => {
    const result = evaluatePlan({
      ...agm([{ name: 'Pump', watts: 60, hoursPerDay: 24 }]),
      bank: { chemistry: 'agm', capacityAh: 100, peukertExponent: 1.2, ratedHours: 100, depthOfDischarge: 1 },
    });
    expect(result.hourly[13]?.stateOfChargePercent).toBeGreaterThan(0); // after 14 h
    expect(result.hourly[13]?.stateOfChargePercent).toBeLessThan(5);
    expect(result.hourly[14]?.stateOfChargePercent).toBe(0); // after 15 h
  });

  it('judges a 1,800 W cooktop for 30 minutes on a 200 Ah AGM bank at its real draw: too much, though the day’s average would pass', () => {
    const cooktop = evaluatePlan(agm([{ name: 'Induction cooktop', watts: 1800, hoursPerDay: 0.5, activeHours: [18], ac: true }], { ratedW: 2000, efficiency: 0.9 }));
    // 1,000 Wh from the bank (85.8 Ah with the inverter's idle hour) is within the 100 Ah usable,
    // but at about 169 A the hour takes (169 × 20 / 200)^0.1 = 1.33 times that.
    expect(cooktop.dailyAmpHours).toBeLessThan(100);
    expect(cooktop.verdict.kind).toBe('bank-too-small');
    expect(cooktop.findings[0]).toMatchObject({ code: 'bank-runs-low', severity: 'critical' });
    const spread = evaluatePlan(agm([{ name: 'Heater', watts: 75, hoursPerDay: 12, activeHours: [8, 9, 10, 11, 12, 13, 14, 15, 16, 17, 18, 19] }]));
    expect(spread.dailyWattHours).toBeCloseTo(900, 9);
    expect(spread.verdict.kind).toBe('bank-ok');
  });
});

// Common practice, no source: the last 20 % of a lead-acid charge goes in slowly, about four hours
// whatever the charger.
describe('lead-acid absorption taper (common practice, no source)', () => {
  it('takes hours to refill half a 100 Ah AGM bank with a 50 A charger, not the 1.1 h a straight fill would', () => {
    const plan: PlanInput = {
      systemV: 12,
      gauge: 'awg',
      loads: [{ name: 'Fridge', watts: 50, hoursPerDay: 12, activeHours: [0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11] }],
      bank: { chemistry: 'agm', capacityAh: 100 },
      starterBattery: { capacityAh: 70 },
      dcdcCharger: { outputA: 50 },
      trip: { daysParked: 0, daysDriving: 1, driveHoursPerDay: 6, driveStartHour: 12, lowestC: 25 },
      circuits: [],
    };
    const result = evaluatePlan(plan);
    expect(result.driveHoursToRefill).toBeGreaterThan(3);
    expect(result.driveHoursToRefill).toBeLessThan(6);
    // A lithium bank of the same size refills in about an hour.
    expect(evaluatePlan({ ...plan, bank: { chemistry: 'lifepo4', capacityAh: 100 } }).driveHoursToRefill).toBeLessThan(1.5);
  });
});
