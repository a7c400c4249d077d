import {
  coldCapacityFactor,
  conductorAmpacityA,
  conductorLabel,
  dailyEnergy,
  hoursToRefill,
  peukertDrawAh,
  selectConductor,
  voltageDrop,
  type ConductorSize,
} from '@busbar/calc';
import { describe, expect, it } from 'vitest';

// Hand-worked examples; resistances from NEC Table 8 and IEC 60228, amperages from 33 CFR 183.425.
describe('selectConductor', () => {
  it('lets the fuse decide a short heavy run: 100 A over 0.5 m at 105 °C takes a 125 A fuse, so 4 AWG (160 A; 6 AWG carries 120 A)', () => {
    const choice = selectConductor({ currentA: 100, oneWayLengthM: 0.5, systemV: 12, maxDropPercent: 10, insulationC: 105, gauge: 'awg' });
    expect(choice?.size).toEqual({ awg: '4' });
    expect(choice?.ampacityA).toBe(160);
    expect(choice?.decidedBy).toBe('ampacity');
    expect(choice?.dropV).toBeCloseTo((100 * 1 * 0.308) / 304.8, 9); // 0.101 V
  });

  it('chooses metric sizes at 75 °C: 10 A over 3 m at 3 % needs ≤ 6 Ω/km; 4 mm² is 4.95 × 309.5 / 254.5 = 6.02, so 6 mm²', () => {
    const choice = selectConductor({ currentA: 10, oneWayLengthM: 3, systemV: 12, maxDropPercent: 3, insulationC: 105, gauge: 'mm2' });
    expect(choice?.size).toEqual({ mm2: 6 });
    expect(choice?.dropPercent).toBeCloseTo((100 * 10 * 6 * ((0.0033 * 309.5) / 254.5)) / 12, 9); // 2.01 %
    expect(choice?.decidedBy).toBe('drop');
    // At 20 °C (the table's own temperature) 4 mm² would have passed.
    expect(selectConductor({ currentA: 10, oneWayLengthM: 3, systemV: 12, maxDropPercent: 3, insulationC: 105, gauge: 'mm2', temperatureC: 20 })?.size).toEqual({ mm2: 4 });
  });

  it('never recommends less than 16 AWG, however small the load: 1 A over 1 m', () => {
    const choice = selectConductor({ currentA: 1, oneWayLengthM: 1, systemV: 12, maxDropPercent: 10, insulationC: 105, gauge: 'awg' });
    expect(choice).toMatchObject({ size: { awg: '16' }, decidedBy: 'minimum' });
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

describe("Peukert's law hour by hour", () => {
  it('counts a draw at the rated current as drawn: 5 A from a 100 Ah, 20-hour bank', () => {
    expect(peukertDrawAh({ drawnAh: 5, currentA: 5, capacityAh: 100, ratedHours: 20, exponent: 1.25 })).toBeCloseTo(5, 9);
  });

  it('weighs a heavy draw more: 10 A from a 100 Ah, 20-hour flooded bank (k 1.25) takes 10 × 2^0.25 = 11.89 Ah an hour', () => {
    expect(peukertDrawAh({ drawnAh: 10, currentA: 10, capacityAh: 100, ratedHours: 20, exponent: 1.25 })).toBeCloseTo(11.892, 3);
  });

  it('never credits a light draw with less than it takes', () => {
    expect(peukertDrawAh({ drawnAh: 1, currentA: 1, capacityAh: 100, ratedHours: 20, exponent: 1.25 })).toBe(1);
  });
});

describe('cold lead-acid', () => {
  it('holds its rating at 25 °C and above, less below', () => {
    expect(coldCapacityFactor('agm', 30)).toBe(1);
    expect(coldCapacityFactor('agm', 0)).toBeCloseTo(0.8, 9);
    expect(coldCapacityFactor('flooded', -20)).toBeCloseTo(0.64, 9);
    expect(coldCapacityFactor('lifepo4', -20)).toBe(1);
  });
});

describe('refill hours', () => {
  it('counts refill hours net of the loads, and none when the charger cannot gain on them', () => {
    expect(hoursToRefill({ refillAh: 90, chargerA: 40, chargeEfficiency: 0.9, loadA: 6 })).toBeCloseTo(3, 9);
    expect(hoursToRefill({ refillAh: 90, chargerA: 5, chargeEfficiency: 0.9, loadA: 6 })).toBeNull();
  });

  it('takes the tail of a lead-acid charge at the taper rate: 70 Ah at 30 A net, then 20 Ah at 5 A', () => {
    expect(hoursToRefill({ refillAh: 90, chargerA: 40, chargeEfficiency: 0.9, loadA: 6, taper: { tailAh: 20, acceptA: 5 } })).toBeCloseTo(70 / 30 + 4, 9);
  });
});
