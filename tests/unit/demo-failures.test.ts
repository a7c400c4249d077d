import { describe, expect, it } from 'vitest';
import { failureAt, type ClaimShop } from '../../db/demo/claims-draw.ts';
import { TIGHT_DESIGN_FACTOR, WORKMANSHIP, WORKMANSHIP_FACTOR } from '../../db/demo/claims-rates.ts';
import { seededRandom } from '../../db/demo/random.ts';

const YEAR_MS = 365.25 * 86_400_000;
const shopOf = (code: string): ClaimShop => ({ id: 1, code, timeZone: 'America/Denver', clerkId: 1, leadId: 2, managerId: 3, approvalLimitCents: 50_000 });

/** Share of units whose connection fails within their first year. */
function looseInFirstYear(code: string, tightDesign: boolean, units = 40_000): number {
  const random = seededRandom(tightDesign ? 11 : 12);
  let loose = 0;
  for (let i = 0; i < units; i++) {
    const failure = failureAt(random, { sku: 'TDW-DC25', category: 'dc_dc_charger', deliveredAt: 0, inBadBatch: false, tightDesign }, shopOf(code));
    if (failure!.workmanship && failure!.at < YEAR_MS) loose++;
  }
  return loose / units;
}

describe("the demo's loose connections", () => {
  it('come about four times as often on a build planned past a conductor limit, on top of the shop’s own factor', () => {
    const expected = (factor: number) => 1 - (1 - WORKMANSHIP.firstYearShare) ** factor;
    const roomy = looseInFirstYear('DEN', false);
    const tight = looseInFirstYear('DEN', true);
    // The unit's own failure comes first now and then, so a little fewer than the hazard alone gives.
    const near = (share: number, factor: number) => {
      expect(share).toBeGreaterThan(0.85 * expected(factor));
      expect(share).toBeLessThan(expected(factor) + 0.003);
    };
    near(roomy, 1);
    near(tight, TIGHT_DESIGN_FACTOR);
    expect(tight / roomy).toBeGreaterThan(3);
    expect(tight / roomy).toBeLessThan(5);
    near(looseInFirstYear('AUS', true), TIGHT_DESIGN_FACTOR * WORKMANSHIP_FACTOR.AUS!);
  });
});
