import { buildTotals } from '@busbar/calc';
import { describe, expect, it } from 'vitest';

// Hand-worked examples: each figure below was worked out on paper, line by line.
describe('buildTotals', () => {
  it('adds parts at their captured prices and labor at the location rate', () => {
    // 1 × house battery at $899.00 (cost $610.00) + 2 × fuse at $12.50 (cost $4.10)
    // parts: 899.00 + 25.00 = $924.00; cost: 610.00 + 8.20 = $618.20; margin $305.80
    // labor: 3.5 h × $145.00 = $507.50; total $924.00 + $507.50 = $1,431.50
    const totals = buildTotals(
      [
        { quantity: 1, unitPriceCents: 89900, unitCostCents: 61000 },
        { quantity: 2, unitPriceCents: 1250, unitCostCents: 410 },
      ],
      3.5,
      14500,
    );
    expect(totals).toEqual({ partsPriceCents: 92400, partsCostCents: 61820, laborCents: 50750, totalCents: 143150, marginCents: 30580 });
  });

  it('rounds labor to the cent, half away from zero', () => {
    // 1.33 h × $133.33 = $177.3289 → $177.33
    expect(buildTotals([], 1.33, 13333).laborCents).toBe(17733);
    // 0.1 h × $125.00 = $12.50 exactly, with no binary drift
    expect(buildTotals([], 0.1, 12500).laborCents).toBe(1250);
    // 2.25 h × $99.99 = $224.9775 → $224.98
    expect(buildTotals([], 2.25, 9999).laborCents).toBe(22498);
  });

  it('gives a wiring repair with no parts its labor alone', () => {
    // 1.75 h × $115.00 = $201.25
    expect(buildTotals([], 1.75, 11500)).toEqual({ partsPriceCents: 0, partsCostCents: 0, laborCents: 20125, totalCents: 20125, marginCents: 0 });
  });

  it('is zero for an empty draft', () => {
    expect(buildTotals([], 0, 14500).totalCents).toBe(0);
  });
});
