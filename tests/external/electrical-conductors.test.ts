import { awgAreaMm2, AWG_SIZES, awgCircularMils, conductorResistanceOhmsPerM, feetToMeters, MM2_SIZES, selectConductor, voltageDrop, type Awg, type Mm2 } from '@busbar/calc';
import { describe, expect, it } from 'vitest';

const METRES_PER_KFT = 304.8; // 1,000 international feet

// Source: NFPA 70 (NEC), Chapter 9, Table 8 — DC resistance of uncoated stranded copper at 75 °C,
// Ω per 1,000 ft, as transcribed in a secondary copy (CHECKS.md [P2]).
const NEC_TABLE_8_OHMS_PER_KFT: Record<Awg, number> = {
  '18': 7.95, '16': 4.99, '14': 3.14, '12': 1.98, '10': 1.24, '8': 0.778, '6': 0.491, '4': 0.308,
  '3': 0.245, '2': 0.194, '1': 0.154, '1/0': 0.122, '2/0': 0.0967, '3/0': 0.0766, '4/0': 0.0608,
};

// Source: IEC 60228:2004, Table 3, class 5 (flexible) plain copper, maximum resistance at 20 °C,
// Ω per km (CHECKS.md [P2]).
const IEC_60228_CLASS_5_OHMS_PER_KM: Record<Mm2, number> = {
  1.5: 13.3, 2.5: 7.98, 4: 4.95, 6: 3.3, 10: 1.91, 16: 1.21, 25: 0.78, 35: 0.554, 50: 0.386, 70: 0.272, 95: 0.206,
};

// From memory: NEC Chapter 9 Table 8, "Area, circular mils" column (ASTM B258 sizes).
const NEC_TABLE_8_CIRCULAR_MILS: Record<Awg, number> = {
  '18': 1620, '16': 2580, '14': 4110, '12': 6530, '10': 10380, '8': 16510, '6': 26240, '4': 41740,
  '3': 52620, '2': 66360, '1': 83690, '1/0': 105600, '2/0': 133100, '3/0': 167800, '4/0': 211600,
};

describe('conductor resistance', () => {
  it.each(AWG_SIZES)('reads %s AWG from NEC Chapter 9 Table 8 (stranded, 75 °C)', (awg) => {
    expect(conductorResistanceOhmsPerM({ awg }) * METRES_PER_KFT).toBeCloseTo(NEC_TABLE_8_OHMS_PER_KFT[awg], 9);
  });

  it('uses the stranded values for 14–8 AWG, not the solid ones some copies show (NEC Table 8)', () => {
    const solid = { '14': 3.07, '12': 1.93, '10': 1.21, '8': 0.764 } as const;
    for (const [awg, solidOhmsPerKft] of Object.entries(solid)) {
      const ohmsPerKft = conductorResistanceOhmsPerM({ awg: awg as Awg }) * METRES_PER_KFT;
      expect(ohmsPerKft).toBeGreaterThan(solidOhmsPerKft * 1.01);
    }
  });

  it.each(MM2_SIZES)('reads %s mm² from IEC 60228 Table 3, class 5 (20 °C)', (mm2) => {
    expect(conductorResistanceOhmsPerM({ mm2 }, { temperatureC: 20 }) * 1000).toBeCloseTo(IEC_60228_CLASS_5_OHMS_PER_KM[mm2], 9);
  });

  it.each(AWG_SIZES)('gives %s AWG the area of NEC Table 8 within 0.5 % (from memory)', (awg) => {
    const published = NEC_TABLE_8_CIRCULAR_MILS[awg];
    expect(Math.abs(awgCircularMils(awg) - published) / published).toBeLessThan(0.005);
  });
});

// Source: IEC 60228 Annex B (CHECKS.md [P]): R_t = R_20 × (234.5 + t) / 254.5 for copper; 75 °C
// gives × 1.216. Every conductor is computed at one temperature, 75 °C unless the plan says.
describe('conductors at one temperature (IEC 60228 Annex B)', () => {
  it.each(MM2_SIZES)('moves %s mm² from 20 °C to 75 °C by × 1.216', (mm2) => {
    const ratio = conductorResistanceOhmsPerM({ mm2 }) / conductorResistanceOhmsPerM({ mm2 }, { temperatureC: 20 });
    expect(ratio).toBeCloseTo(1.216, 3);
  });

  it('moves AWG from Table 8’s 75 °C to 20 °C by the same law', () => {
    expect(conductorResistanceOhmsPerM({ awg: '10' }) / conductorResistanceOhmsPerM({ awg: '10' }, { temperatureC: 20 })).toBeCloseTo(1.216, 3);
  });

  // From memory: annealed copper is 1/58 Ω·mm²/m at 20 °C (IEC 60028). Resistance × area compares
  // the two tables for the same copper area at the same temperature.
  const ohmMm2PerKm = (size: { awg: Awg } | { mm2: Mm2 }, temperatureC: number) =>
    conductorResistanceOhmsPerM(size, { temperatureC }) * 1000 * ('awg' in size ? awgAreaMm2(size.awg) : size.mm2);

  it.each(AWG_SIZES)('has %s AWG within 3 % of annealed copper at 20 °C (stranding adds about 2 %)', (awg) => {
    expect(ohmMm2PerKm({ awg }, 20) / (1000 / 58)).toBeGreaterThan(0.99);
    expect(ohmMm2PerKm({ awg }, 20) / (1000 / 58)).toBeLessThan(1.03);
  });

  it.each(MM2_SIZES)('has %s mm² at least as resistive per area as AWG at the same temperature, never the 18 % lower it read at 20 °C', (mm2) => {
    // IEC 60228 lists maximum resistances, 10–16 % above annealed copper, so the metric path is the
    // more cautious one at one temperature; mixing 20 °C with 75 °C made it the less cautious one.
    const awgMean = AWG_SIZES.reduce((sum, awg) => sum + ohmMm2PerKm({ awg }, 75), 0) / AWG_SIZES.length;
    expect(ohmMm2PerKm({ mm2 }, 75) / awgMean).toBeGreaterThan(1);
    expect(ohmMm2PerKm({ mm2 }, 75) / awgMean).toBeLessThan(1.16);
    expect(ohmMm2PerKm({ mm2 }, 20) / awgMean).toBeLessThan(0.95);
  });

  it('makes tinned copper a few percent more resistive than plain (IEC 60228 Table 3; NEC Table 8 coated)', () => {
    for (const size of [...AWG_SIZES.map((awg) => ({ awg })), ...MM2_SIZES.map((mm2) => ({ mm2 }))]) {
      const ratio = conductorResistanceOhmsPerM(size, { tinned: true }) / conductorResistanceOhmsPerM(size);
      expect(ratio).toBeGreaterThan(1.01);
      expect(ratio).toBeLessThan(1.07);
    }
  });
});

// Worked example (CHECKS.md [C]): 10 A over a 20 ft round trip, 3 % of 12 V = 0.36 V. The
// circular-mil method CM = 10.75 × I × L / E gives 5,972 cmil, so 12 AWG (6,530 cmil). A drop from
// Table 8 resistance runs about 20 % higher than the K = 10.75 method.
describe('voltage drop against the K = 10.75 worked example', () => {
  const kMethodCmil = (10.75 * 10 * 20) / 0.36;
  const oneWayLengthM = feetToMeters(10);

  it('finds 12 AWG as the smallest size by the K = 10.75 method', () => {
    expect(kMethodCmil).toBeCloseTo(5972, 0);
    const smallest = AWG_SIZES.find((awg) => awgCircularMils(awg) >= kMethodCmil);
    expect(smallest).toBe('12');
    expect(awgCircularMils('12')).toBeCloseTo(6530, -1);
  });

  it('computes the Table 8 drop over the round trip, about 20 % above the K = 10.75 drop', () => {
    const drop = voltageDrop({ currentA: 10, oneWayLengthM, size: { awg: '12' }, systemV: 12 });
    expect(drop.dropV).toBeCloseTo((10 * 20 * 1.98) / 1000, 9); // 0.396 V
    expect(drop.dropPercent).toBeCloseTo(3.3, 9);
    const kMethodDropV = (10.75 * 10 * 20) / 6530;
    expect(drop.dropV / kMethodDropV).toBeGreaterThan(1.15);
    expect(drop.dropV / kMethodDropV).toBeLessThan(1.25);
  });

  it.each(AWG_SIZES)('keeps the Table 8 / K = 10.75 ratio near 1.2 at %s AWG', (awg) => {
    const kMethodOhmsPerKft = (10.75 / NEC_TABLE_8_CIRCULAR_MILS[awg]) * 1000;
    const ratio = NEC_TABLE_8_OHMS_PER_KFT[awg] / kMethodOhmsPerKft;
    expect(conductorResistanceOhmsPerM({ awg }) * METRES_PER_KFT / kMethodOhmsPerKft).toBeCloseTo(ratio, 9);
    expect(ratio).toBeGreaterThan(1.15);
    expect(ratio).toBeLessThan(1.25);
  });

  it('therefore picks 10 AWG where the K = 10.75 method accepts 12 AWG (it errs large)', () => {
    const choice = selectConductor({ currentA: 10, oneWayLengthM, systemV: 12, maxDropPercent: 3, insulationC: 105, gauge: 'awg' });
    expect(choice?.size).toEqual({ awg: '10' });
    expect(choice?.dropV).toBeCloseTo((10 * 20 * 1.24) / 1000, 9); // 0.248 V
    expect(choice?.decidedBy).toBe('drop');
  });
});
