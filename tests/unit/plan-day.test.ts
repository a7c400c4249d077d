import { BATTERY_CHEMISTRIES, evaluatePlan, type PlanInput } from '@busbar/calc';
import { describe, expect, it } from 'vitest';

// One day worked by hand on a 100 Ah LiFePO4 bank (80 % usable) starting full.
const oneDay = (patch: Partial<PlanInput>): PlanInput => ({
  systemV: 12,
  gauge: 'awg',
  loads: [{ name: 'Router', watts: 12, hoursPerDay: 24 }], // 1 A all day
  bank: { chemistry: 'lifepo4', capacityAh: 100 },
  starterBattery: { capacityAh: 50 },
  trip: { daysParked: 1, daysDriving: 0, driveHoursPerDay: 0, lowestC: 25, highestC: 25 },
  circuits: [],
  ...patch,
});
const charge = BATTERY_CHEMISTRIES.lifepo4.chargeEfficiency;

describe('state of charge through one day', () => {
  it('falls 1 % an hour under a steady 1 A load', () => {
    const result = evaluatePlan(oneDay({}));
    expect(result.hourly.map((h) => h.stateOfChargePercent)).toEqual(Array.from({ length: 24 }, (_, i) => expect.closeTo(99 - i, 9)));
    expect(result.daysOfAutonomy).toBeCloseTo(80 / 24, 9);
  });

  it('takes the day’s solar (PVWatts losses, controller, charge efficiency) against the day’s loads', () => {
    // 2 A all day = 48 Ah; 100 W × 5 h × (1 − 0.1408) through a 95 % MPPT controller, the module at
    // 25 °C air + 25 °C losing 0.47 %/°C over 25 °C (× 0.8825), at 12 V, stored at the charge efficiency.
    const result = evaluatePlan(oneDay({ loads: [{ name: 'Fridge', watts: 24, hoursPerDay: 24 }], solar: { arrayW: 100, peakSunHours: 5, controller: 'mppt' } }));
    const solarAh = ((100 * 5 * (1 - 0.1408) * 0.95 * 0.8825) / 12) * charge;
    expect(result.hourly.at(-1)?.stateOfChargePercent).toBeCloseTo(100 - (48 - solarAh), 1);
    expect(result.netDailyAh.parked).toBeCloseTo(solarAh - 48, 1);
    expect(result.hourly[5]?.stateOfChargePercent).toBeCloseTo(88, 9); // no sun before 06:00
  });

  it('refills while driving from 09:00 and draws down after', () => {
    // Deficit 9 Ah at 09:00; the 20 A charger stores 19 Ah an hour, so full by 10:00 and 11:00;
    // then 13 hours at 1 A.
    const result = evaluatePlan(oneDay({ dcdcCharger: { outputA: 20 }, trip: { daysParked: 0, daysDriving: 1, driveHoursPerDay: 2, lowestC: 25 } }));
    expect(result.hourly[8]?.stateOfChargePercent).toBeCloseTo(91, 9);
    expect(result.hourly[10]?.stateOfChargePercent).toBeCloseTo(100, 9);
    expect(result.hourly[23]?.stateOfChargePercent).toBeCloseTo(87, 9);
    expect(result.netDailyAh.driving).toBeCloseTo(2 * 20 * charge - 24, 9);
  });

  it('takes shore power from 18:00 on a parked day', () => {
    // Deficit 18 Ah at 18:00; 10 A stores 9.5 Ah an hour less the 1 A load: full in the third hour,
    // then 22:00 and 23:00 at 1 A.
    const result = evaluatePlan(oneDay({ shoreCharger: { outputA: 10, hoursPerParkedDay: 4 } }));
    expect(result.hourly[17]?.stateOfChargePercent).toBeCloseTo(82, 9);
    expect(result.hourly[20]?.stateOfChargePercent).toBeCloseTo(100, 9);
    expect(result.hourly[23]?.stateOfChargePercent).toBeCloseTo(98, 9);
  });

  it("weighs each hour of a heavily drawn AGM bank by Peukert's law: 10 A from 100 Ah (k 1.1, 20-hour rating) takes 10 × 2^0.1 Ah an hour", () => {
    const result = evaluatePlan(oneDay({ loads: [{ name: 'Heater', watts: 120, hoursPerDay: 24 }], bank: { chemistry: 'agm', capacityAh: 100 } }));
    expect(result.bank.effectiveCapacityAh).toBe(100);
    expect(result.hourly[0]?.stateOfChargePercent).toBeCloseTo(100 - 10 * 2 ** 0.1, 9); // 89.28 %
  });

  it('holds less in a cold lead-acid bank: 100 Ah AGM at 0 °C holds 80 Ah (from memory)', () => {
    const result = evaluatePlan(oneDay({ bank: { chemistry: 'agm', capacityAh: 100 }, trip: { daysParked: 1, daysDriving: 0, driveHoursPerDay: 0, lowestC: 0 } }));
    expect(result.bank.effectiveCapacityAh).toBeCloseTo(80, 9);
    expect(result.bank.usableAh).toBeCloseTo(40, 9);
  });

  it('counts the inverter idling through the hours its AC loads may run: 15 W for 4 hours', () => {
    const laptop = { name: 'Laptop', watts: 45, hoursPerDay: 2, activeHours: [18, 19, 20, 21], ac: true };
    const result = evaluatePlan(oneDay({ loads: [laptop], inverter: { ratedW: 1000, efficiency: 0.9 } }));
    expect(result.inverterIdleWh).toBeCloseTo(1000 * 0.015 * 4, 9);
    expect(result.dailyWattHours).toBeCloseTo(90 / 0.9 + 60, 9);
  });
});
