import { benjaminiHochberg } from '@busbar/calc';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';

describe('benjaminiHochberg', () => {
  // Benjamini & Hochberg 1995, section 4: fifteen p-values of a clinical trial (from memory). At 0.05 the
  // step-up rule rejects the four smallest, where Bonferroni (0.05 / 15 = 0.0033) rejects three.
  const published = [0.0001, 0.0004, 0.0019, 0.0095, 0.0201, 0.0278, 0.0298, 0.0344, 0.0459, 0.324, 0.4262, 0.5719, 0.6528, 0.759, 1];

  it('rejects four of the worked example at 0.05, in any order', () => {
    expect(benjaminiHochberg(published, 0.05)).toBe(4);
    expect(benjaminiHochberg([...published].reverse(), 0.05)).toBe(4);
    expect(published.filter((p) => p <= 0.05 / published.length)).toHaveLength(3);
  });

  it('rejects at least what Bonferroni rejects and never more than the p-values at or below the rate', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 1, maxLength: 60 }), fc.constantFrom(0.01, 0.05, 0.1), (pValues, rate) => {
        const rejected = benjaminiHochberg(pValues, rate);
        expect(rejected).toBeGreaterThanOrEqual(pValues.filter((p) => p <= rate / pValues.length).length);
        expect(rejected).toBeLessThanOrEqual(pValues.filter((p) => p <= rate).length);
      }),
      { seed: 10_020, numRuns: 300 },
    );
  });

  it('refuses a rate outside (0, 1) and p-values outside [0, 1]', () => {
    expect(() => benjaminiHochberg([0.2], 1)).toThrow(/rate must be/);
    expect(() => benjaminiHochberg([1.2], 0.05)).toThrow(/pValues\[0\] must be/);
  });
});
