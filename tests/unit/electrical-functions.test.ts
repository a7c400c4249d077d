import {
  capacityForUsableAh,
  conductorAmpacityA,
  conductorLabel,
  dailyEnergy,
  hoursToRefill,
  selectConductor,
  usableCapacity,
  voltageDrop,
  type ConductorSize,
} from '@busbar/calc';
import { describe, expect, it } from 'vitest';

// Hand-worked examples; resistances from NEC Table 8 and IEC 60228, amperages from 33 CFR 183.425.
describe('selectConductor', () => {
  it('lets amperage decide a short heavy run: 100 A over 0.5 m at 105 °C needs 6 AWG (120 A; 8 AWG carries 80 A)', () => {
    const choice = selectConductor({ currentA: 100, oneWayLengthM: 0.5, systemV: 12, maxDropPercent: 10, insulationC: 105, gauge: 'awg' });
    expect(choice?.size).toEqual({ awg: '6' });
    expect(choice?.ampacityA).toBe(120);
    expect(choice?.decidedBy).toBe('ampacity');
    expect(choice?.dropV).toBeCloseTo((100 * 1 * 0.491) / 304.8, 9); // 0.161 V
  });

  it('chooses metric sizes: 10 A over 3 m at 3 % needs ≤ 6 Ω/km, so 4 mm² (4.95 Ω/km; 2.5 mm² is 7.98)', () => {
    const choice = selectConductor({ currentA: 10, oneWayLengthM: 3, systemV: 12, maxDropPercent: 3, insulationC: 105, gauge: 'mm2' });
    expect(choice?.size).toEqual({ mm2: 4 });
    expect(choice?.dropPercent).toBeCloseTo((100 * 10 * 6 * 0.00495) / 12, 9); // 2.475 %
    expect(choice?.decidedBy).toBe('drop');
  });

  it('answers null when no size in the table carries the load within the drop', () => {
    expect(selectConductor({ currentA: 400, oneWayLengthM: 30, systemV: 12, maxDropPercent: 3, insulationC: 105, gauge: 'awg' })).toBeNull();
    expect(selectConductor({ currentA: 600, oneWayLengthM: 0.2, systemV: 12, maxDropPercent: 10, insulationC: 60, gauge: 'mm2' })).toBeNull();
  });

  it('rejects a missing, negative or NaN input, naming it', () => {
    const good = { currentA: 10, oneWayLengthM: 3, systemV: 12, maxDropPercent: 3, insulationC: 105, gauge: 'awg' } as const;
    expect(() => selectConductor({ ...good, currentA: -1 })).toThrow(/currentA/);
    expect(() => selectConductor({ ...good, oneWayLengthM: Number.NaN })).toThrow(/oneWayLengthM/);
    expect(() => selectConductor({ ...good, maxDropPercent: 0 })).toThrow(/maxDropPercent/);
    expect(() => selectConductor({ ...good, insulationC: 70 as 75 })).toThrow(/insulationC/);
  });
});

describe('sizes and their checks', () => {
  it('rejects an unknown gauge or size, naming the field', () => {
    expect(() => voltageDrop({ currentA: 1, oneWayLengthM: 1, size: { awg: '5' } as unknown as ConductorSize, systemV: 12 })).toThrow(/size\.awg/);
    expect(() => conductorAmpacityA({ size: { mm2: 3 } as unknown as ConductorSize, insulationC: 105 })).toThrow(/size\.mm2/);
    expect(() => conductorAmpacityA({ size: {} as ConductorSize, insulationC: 105 })).toThrow(/size/);
    expect(() => conductorAmpacityA({ size: { awg: '10' }, insulationC: 105, bundledConductors: 2.5 })).toThrow(/bundledConductors/);
  });

  it('labels sizes the way people write them', () => {
    expect(conductorLabel({ awg: '2/0' })).toBe('2/0 AWG');
    expect(conductorLabel({ mm2: 2.5 })).toBe('2.5 mm²');
  });
});

describe('dailyEnergy', () => {
  it('adds duty-cycled DC loads and AC loads through the inverter', () => {
    const energy = dailyEnergy(
      [
        { name: 'Fridge', watts: 60, hoursPerDay: 24, dutyCycle: 0.5 }, // 720 Wh
        { name: 'Lights', watts: 12, hoursPerDay: 5 }, // 60 Wh
        { name: 'Laptop', watts: 45, hoursPerDay: 4, ac: true }, // 180 / 0.9 = 200 Wh
      ],
      { systemV: 12, inverterEfficiency: 0.9 },
    );
    expect(energy.wattHours).toBeCloseTo(980, 9);
    expect(energy.ampHours).toBeCloseTo(980 / 12, 9);
  });

  it('rejects a load running more than 24 hours a day, naming it', () => {
    expect(() => dailyEnergy([{ name: 'Heater', watts: 30, hoursPerDay: 25 }], { systemV: 12, inverterEfficiency: 0.9 })).toThrow(/loads\[0\]\.hoursPerDay/);
  });
});

describe('usable capacity and its inverse', () => {
  it("reduces a flooded bank by Peukert's law at a heavy draw: 100 Ah, k 1.25, 10 A → 20 × 0.5^1.25 h × 10 A", () => {
    const usable = usableCapacity({ chemistry: 'flooded', capacityAh: 100, averageCurrentA: 10 });
    expect(usable.effectiveCapacityAh).toBeCloseTo(200 * 0.5 ** 1.25, 9); // 84.09 Ah
    expect(usable.usableAh).toBeCloseTo(100 * 0.5 ** 1.25, 9);
  });

  it('finds the rating that gives a usable capacity back', () => {
    for (const chemistry of ['lifepo4', 'agm', 'flooded'] as const) {
      for (const averageCurrentA of [0, 1, 10, 40]) {
        const capacityAh = capacityForUsableAh({ chemistry, usableAh: 100, averageCurrentA });
        expect(usableCapacity({ chemistry, capacityAh, averageCurrentA }).usableAh).toBeCloseTo(100, 6);
      }
    }
  });

  it('counts refill hours net of the loads, and none when the charger cannot gain on them', () => {
    expect(hoursToRefill({ refillAh: 90, chargerA: 40, chargeEfficiency: 0.9, loadA: 6 })).toBeCloseTo(3, 9);
    expect(hoursToRefill({ refillAh: 90, chargerA: 5, chargeEfficiency: 0.9, loadA: 6 })).toBeNull();
  });
});
