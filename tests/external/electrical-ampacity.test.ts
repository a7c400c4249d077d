import {
  ampacityAwgForMm2,
  AWG_SIZES,
  circularMilsToMm2,
  conductorAmpacityA,
  evaluatePlan,
  INSULATION_RATINGS_C,
  MM2_SIZES,
  selectFuseA,
  type Awg,
  type InsulationRatingC,
  type PlanInput,
} from '@busbar/calc';
import { describe, expect, it } from 'vitest';

// Source: US 33 CFR 183.425, Table 5 — allowable amperage by insulation rating (60, 75, 80, 90,
// 105, 125, 200 °C), 30 °C ambient (CHECKS.md [P]).
const CFR_TABLE_5: Record<Awg, number[]> = {
  '18': [10, 10, 15, 20, 20, 25, 25],
  '16': [15, 15, 20, 25, 25, 30, 35],
  '14': [20, 20, 25, 30, 35, 40, 45],
  '12': [25, 25, 35, 40, 45, 50, 55],
  '10': [40, 40, 50, 55, 60, 70, 70],
  '8': [55, 65, 70, 70, 80, 90, 100],
  '6': [80, 95, 100, 100, 120, 125, 135],
  '4': [105, 125, 130, 135, 160, 170, 180],
  '3': [120, 145, 150, 155, 180, 195, 210],
  '2': [140, 170, 175, 180, 210, 225, 240],
  '1': [165, 195, 210, 210, 245, 265, 280],
  '1/0': [195, 230, 245, 245, 285, 305, 325],
  '2/0': [225, 265, 285, 285, 330, 355, 370],
  '3/0': [260, 310, 330, 330, 385, 410, 430],
  '4/0': [300, 360, 385, 385, 445, 475, 510],
};
const cells = AWG_SIZES.flatMap((awg) => INSULATION_RATINGS_C.map((insulationC, column) => [awg, insulationC, CFR_TABLE_5[awg][column]!] as const));

describe('conductor amperage, 33 CFR 183.425 Table 5', () => {
  it.each(cells)('%s AWG at %i °C carries %i A', (awg, insulationC, amperes) => {
    expect(conductorAmpacityA({ size: { awg }, insulationC })).toBe(amperes);
  });

  // 105 °C: 33 CFR 183.425 as transcribed (CHECKS.md [P2]); the other ratings from memory.
  const engineSpace: [InsulationRatingC, number][] = [[60, 0.58], [75, 0.75], [80, 0.78], [90, 0.82], [105, 0.85], [125, 0.89], [200, 1]];
  it.each(engineSpace)('derates %i °C insulation in an engine space by %f (105 °C: [P2]; others from memory)', (insulationC, factor) => {
    for (const awg of AWG_SIZES) {
      const outside = conductorAmpacityA({ size: { awg }, insulationC });
      expect(conductorAmpacityA({ size: { awg }, insulationC, engineSpace: true })).toBeCloseTo(outside * factor, 9);
    }
  });

  // From memory: bundling factors 3 → 0.70, 4–6 → 0.60, 7–24 → 0.50, 25 or more → 0.40.
  it.each([[1, 1], [2, 1], [3, 0.7], [4, 0.6], [6, 0.6], [7, 0.5], [24, 0.5], [25, 0.4], [60, 0.4]])(
    'derates a conductor in a bundle of %i by %f (from memory)',
    (bundledConductors, factor) => {
      expect(conductorAmpacityA({ size: { awg: '10' }, insulationC: 105, bundledConductors })).toBeCloseTo(60 * factor, 9);
    },
  );

  it('applies the engine-space and bundling factors together (common practice, no source)', () => {
    expect(conductorAmpacityA({ size: { awg: '10' }, insulationC: 105, engineSpace: true, bundledConductors: 3 })).toBeCloseTo(60 * 0.85 * 0.7, 9);
  });
});

describe('metric conductors read at an AWG size no larger than themselves', () => {
  // From memory: NEC Chapter 9 Table 8 areas, circular mils; 1 cmil = π/4 × (0.0254 mm)².
  const publishedCmil: Record<Awg, number> = {
    '18': 1620, '16': 2580, '14': 4110, '12': 6530, '10': 10380, '8': 16510, '6': 26240, '4': 41740,
    '3': 52620, '2': 66360, '1': 83690, '1/0': 105600, '2/0': 133100, '3/0': 167800, '4/0': 211600,
  };
  const areaMm2 = (awg: Awg) => publishedCmil[awg] * (Math.PI / 4) * 0.0254 ** 2;

  it.each(MM2_SIZES)('maps %s mm² to the largest AWG whose published area does not exceed it', (mm2) => {
    const awg = ampacityAwgForMm2(mm2);
    const next = AWG_SIZES[AWG_SIZES.indexOf(awg) + 1];
    expect(areaMm2(awg)).toBeLessThanOrEqual(mm2);
    if (next) expect(areaMm2(next)).toBeGreaterThan(mm2);
    expect(circularMilsToMm2(publishedCmil[awg])).toBeCloseTo(areaMm2(awg), 9);
  });

  it('gives 25 mm² the amperage of 4 AWG (21.2 mm²), not of the larger 3 AWG (26.7 mm²)', () => {
    expect(conductorAmpacityA({ size: { mm2: 25 }, insulationC: 105 })).toBe(CFR_TABLE_5['4'][4]);
  });
});

// Source: 33 CFR 183.455 — overcurrent protection under 50 V at most 150 % of the conductor's
// Table 5 amperage (CHECKS.md [P]). Busbar applies it to the derated amperage, as the hard ceiling
// for a fitted fuse; what it recommends stays within the conductor's amperage (stricter).
describe('fuse protects its conductor, 33 CFR 183.455', () => {
  it('never recommends a fuse above the amperage, for any size, rating and load', () => {
    for (const [, , amperes] of cells) {
      for (const share of [0.2, 0.5, 0.8, 1]) {
        const fuseA = selectFuseA({ loadA: amperes * share, conductorAmpacityA: amperes });
        if (share === 0.5) expect(fuseA).not.toBeNull();
        if (fuseA === null) continue;
        expect(fuseA).toBeLessThanOrEqual(amperes);
        expect(fuseA).toBeGreaterThanOrEqual(1.25 * amperes * share);
      }
    }
  });

  it('recommends no fuse for 50 A on 10 AWG at 105 °C (60 A): the 70 A it needs is above the wire, though within 150 % (90 A)', () => {
    expect(selectFuseA({ loadA: 40, conductorAmpacityA: 60 })).toBe(50);
    expect(selectFuseA({ loadA: 50, conductorAmpacityA: 60 })).toBeNull();
  });

  it('flags a fitted fuse above 150 % of its wire in a plan, and accepts one at or below it', () => {
    const plan = (fuseA: number): PlanInput => ({
      systemV: 12,
      gauge: 'awg',
      loads: [],
      starterBattery: { capacityAh: 70 },
      trip: { daysParked: 1, daysDriving: 0, driveHoursPerDay: 0 },
      // 16 AWG at 105 °C: 25 A (Table 5), so at most 37.5 A.
      circuits: [{ from: 'Fuse panel', to: 'Pump', oneWayLengthM: 2, currentA: 8, critical: false, insulationC: 105, size: { awg: '16' }, fuseA }],
    });
    expect(evaluatePlan(plan(40)).findings).toContainEqual(expect.objectContaining({ code: 'fuse-does-not-protect-wire', severity: 'critical' }));
    expect(evaluatePlan(plan(35)).findings.map((f) => f.code)).not.toContain('fuse-does-not-protect-wire');
    expect(evaluatePlan(plan(35)).circuits[0]?.maxFuseA).toBeCloseTo(37.5, 9);
    // Between 100 % and 150 % of the wire: a warning, not a refusal.
    expect(evaluatePlan(plan(35)).findings).toEqual([expect.objectContaining({ code: 'fuse-above-wire-rating', severity: 'warning' })]);
    expect(evaluatePlan(plan(25)).findings).toEqual([]);
  });
});

// Source: 33 CFR 183.425(e) (CHECKS.md [P]): a conductor installed separately is at least 16 AWG.
describe('smallest conductor, 33 CFR 183.425(e)', () => {
  const plan = (size?: { awg: '18' }, sheathed?: boolean): PlanInput => ({
    systemV: 12,
    gauge: 'awg',
    loads: [],
    starterBattery: { capacityAh: 70 },
    trip: { daysParked: 1, daysDriving: 0, driveHoursPerDay: 0 },
    circuits: [{ from: 'Fuse panel', to: 'Reading light', oneWayLengthM: 1, currentA: 0.5, critical: false, insulationC: 105, size, sheathed }],
  });

  it('recommends 16 AWG for the smallest load, and warns of a fitted 18 AWG run on its own', () => {
    expect(evaluatePlan(plan()).circuits[0]?.recommended?.size).toEqual({ awg: '16' });
    expect(evaluatePlan(plan({ awg: '18' })).findings.map((f) => f.code)).toEqual(['conductor-below-minimum']);
    expect(evaluatePlan(plan({ awg: '18' }, true)).findings).toEqual([]);
  });
});

// Source: allowed voltage drop for 12 V circuits, 3 % critical (main feeders, electronics,
// charging), 10 % other lighting and non-critical loads (CHECKS.md [P2]).
describe('allowed voltage drop', () => {
  it('allows 3 % on a critical circuit and 10 % on another, and sizes each to it', () => {
    const circuit = { from: 'Battery', to: 'Load', oneWayLengthM: 6, currentA: 15, insulationC: 105 as const };
    const result = evaluatePlan({
      systemV: 12,
      gauge: 'awg',
      loads: [],
      starterBattery: { capacityAh: 70 },
      trip: { daysParked: 1, daysDriving: 0, driveHoursPerDay: 0 },
      circuits: [{ ...circuit, critical: true }, { ...circuit, critical: false }],
    });
    const [critical, other] = result.circuits;
    expect(critical?.maxDropPercent).toBe(3);
    expect(other?.maxDropPercent).toBe(10);
    // 15 A over 12 m round trip: 3 % of 12 V (0.36 V) needs ≤ 2.0 mΩ/m → 6 AWG (0.491 Ω/kft);
    // 10 % (1.2 V) needs ≤ 6.67 mΩ/m → 12 AWG (1.98 Ω/kft = 6.50 mΩ/m).
    expect(critical?.recommended?.size).toEqual({ awg: '6' });
    expect(other?.recommended?.size).toEqual({ awg: '12' });
  });
});
