import {
  bankNominalV,
  BATTERY_CHEMISTRIES,
  evaluatePlan,
  hoursToRefill,
  inverterInputA,
  peukertRuntimeH,
  usableCapacity,
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

  it('has LiFePO4 at 3.2 V per cell, 12.8 V for four in series, 80–100 % usable', () => {
    expect(BATTERY_CHEMISTRIES.lifepo4.cellV).toBe(3.2);
    expect(bankNominalV('lifepo4', 12)).toBeCloseTo(12.8, 9);
    expect(bankNominalV('lifepo4', 24)).toBeCloseTo(25.6, 9);
    const { usableAh } = usableCapacity({ chemistry: 'lifepo4', capacityAh: 100, averageCurrentA: 5 });
    expect(usableAh).toBeGreaterThanOrEqual(80);
    expect(usableAh).toBeLessThanOrEqual(100);
  });

  it('plans a lead-acid bank at half its rating at a light draw (from memory)', () => {
    expect(usableCapacity({ chemistry: 'agm', capacityAh: 200, averageCurrentA: 2 }).usableAh).toBeCloseTo(100, 9);
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
    expect(small.recommendedChargerA).toBeGreaterThan(25);
    expect(small.recommendedChargerA).toBeLessThanOrEqual(50);
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
});
