import {
  AWG_SIZES,
  circularMilsToMm2,
  conductorAmpacityA,
  conductorSizes,
  feetToMeters,
  INSULATION_RATINGS_C,
  metersToFeet,
  MM2_SIZES,
  mm2ToCircularMils,
  selectConductor,
  selectFuseA,
  STANDARD_FUSE_RATINGS_A,
  voltageDrop,
  type ConductorChoice,
} from '@busbar/calc';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';

const runs = { seed: 12_012, numRuns: 300 };

// Position in the size list; no fit ranks above every size.
const rank = (choice: ConductorChoice | null) => {
  if (!choice) return Infinity;
  return 'awg' in choice.size ? AWG_SIZES.indexOf(choice.size.awg) : MM2_SIZES.indexOf(choice.size.mm2);
};

const circuit = fc.record({
  systemV: fc.constantFrom(12, 24),
  maxDropPercent: fc.constantFrom(3, 10),
  insulationC: fc.constantFrom(...INSULATION_RATINGS_C),
  engineSpace: fc.boolean(),
  bundledConductors: fc.integer({ min: 1, max: 30 }),
  gauge: fc.constantFrom('awg' as const, 'mm2' as const),
});
const current = fc.double({ min: 0.1, max: 400, noNaN: true });
const length = fc.double({ min: 0.1, max: 20, noNaN: true });

describe('conductor choice is monotonic', () => {
  it('never picks a smaller conductor for more current', () => {
    fc.assert(
      fc.property(circuit, current, current, length, (c, a, b, oneWayLengthM) => {
        const [less, more] = a <= b ? [a, b] : [b, a];
        expect(rank(selectConductor({ ...c, currentA: more, oneWayLengthM }))).toBeGreaterThanOrEqual(rank(selectConductor({ ...c, currentA: less, oneWayLengthM })));
      }),
      runs,
    );
  });

  it('never picks a smaller conductor for a longer run', () => {
    fc.assert(
      fc.property(circuit, current, length, length, (c, currentA, a, b) => {
        const [shorter, longer] = a <= b ? [a, b] : [b, a];
        expect(rank(selectConductor({ ...c, currentA, oneWayLengthM: longer }))).toBeGreaterThanOrEqual(rank(selectConductor({ ...c, currentA, oneWayLengthM: shorter })));
      }),
      runs,
    );
  });

  it('meets both limits with the size it picks, its amperage covering the fuse', () => {
    fc.assert(
      fc.property(circuit, current, length, (c, currentA, oneWayLengthM) => {
        const choice = selectConductor({ ...c, currentA, oneWayLengthM });
        if (!choice) return;
        expect(choice.dropPercent).toBeLessThanOrEqual(c.maxDropPercent);
        expect(choice.ampacityA).toBeGreaterThanOrEqual(1.25 * currentA);
        const fuseA = selectFuseA({ loadA: currentA, conductorAmpacityA: choice.ampacityA });
        if (currentA <= 400) expect(fuseA).not.toBeNull();
      }),
      runs,
    );
  });

  it('picks the smallest size that does: the next smaller one breaks a limit or is below 16 AWG / 1.5 mm²', () => {
    fc.assert(
      fc.property(circuit, current, length, (c, currentA, oneWayLengthM) => {
        const choice = selectConductor({ ...c, currentA, oneWayLengthM });
        if (!choice) return;
        const sizes = conductorSizes(c.gauge);
        const smaller = sizes[rank(choice) - 1];
        if (!smaller || ('awg' in smaller && smaller.awg === '18')) return;
        const drop = voltageDrop({ currentA, oneWayLengthM, size: smaller, systemV: c.systemV });
        const ampacityA = conductorAmpacityA({ size: smaller, insulationC: c.insulationC, engineSpace: c.engineSpace, bundledConductors: c.bundledConductors });
        const fuseA = STANDARD_FUSE_RATINGS_A.find((r) => r >= 1.25 * currentA) ?? 1.25 * currentA;
        expect(drop.dropPercent > c.maxDropPercent || ampacityA < fuseA).toBe(true);
      }),
      runs,
    );
  });
});

describe('fuse choice', () => {
  it('picks the smallest standard rating at or above 125 % of the load, and only within the conductor amperage', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 500, noNaN: true }), fc.double({ min: 1, max: 600, noNaN: true }), (loadA, conductorAmpacityA) => {
        const fuseA = selectFuseA({ loadA, conductorAmpacityA });
        const smallest = STANDARD_FUSE_RATINGS_A.find((r) => r >= 1.25 * loadA);
        expect(fuseA).toBe(smallest !== undefined && smallest <= conductorAmpacityA ? smallest : null);
        if (fuseA !== null) expect(fuseA).toBeLessThanOrEqual(1.5 * conductorAmpacityA);
      }),
      runs,
    );
  });
});

describe('unit conversions round-trip', () => {
  const positive = fc.double({ min: 1e-6, max: 1e7, noNaN: true });
  it('metres ↔ feet', () => {
    fc.assert(fc.property(positive, (x) => {
      expect(feetToMeters(metersToFeet(x)) / x).toBeCloseTo(1, 12);
      expect(metersToFeet(feetToMeters(x)) / x).toBeCloseTo(1, 12);
    }), runs);
  });
  it('mm² ↔ circular mils', () => {
    fc.assert(fc.property(positive, (x) => {
      expect(circularMilsToMm2(mm2ToCircularMils(x)) / x).toBeCloseTo(1, 12);
      expect(mm2ToCircularMils(circularMilsToMm2(x)) / x).toBeCloseTo(1, 12);
    }), runs);
  });
  it('has one foot at exactly 0.3048 m and 1 mm² at 1,973.5 cmil (definitions of the foot and the circular mil)', () => {
    expect(feetToMeters(1)).toBe(0.3048);
    expect(mm2ToCircularMils(1)).toBeCloseTo(1973.5, 1);
  });
});
