import type { RollupFigures, Rollups } from '@busbar/shared';
import { describe, expect, it } from 'vitest';
import { keyFigures } from '../../apps/web/src/views/network/keyFigures.ts';

const sums = (period: string, buildsDelivered: number, claimsOpened: number, revenueCents?: number) =>
  ({ period, buildsDelivered, claimsOpened, ...(revenueCents === undefined ? {} : { revenueCents }) }) as RollupFigures & { period: string };
const rollups = (scope: ReturnType<typeof sums>[]): Rollups => ({
  grain: 'month',
  periods: [{ period: '2026-05', start: '2026-05-01', end: '2026-05-31', previous: '2026-04', lastYear: '2025-05' }],
  page: 1,
  pageSize: 25,
  total: 3,
  locationIds: [],
  rows: [],
  scope,
  regions: [],
  network: [],
});

describe("the last month's key figures", () => {
  it("read the person's shops together and say each change against the month before and a year before", () => {
    const key = keyFigures(rollups([sums('2026-05', 10, 2, 1000_00), sums('2026-04', 8, 1, 1200_00), sums('2025-05', 10, 0, 1000_00)]))!;
    expect(key).toMatchObject({ month: '2026-05', start: '2026-05-01', end: '2026-05-31' });
    expect(key.figures).toEqual([
      { label: 'Builds delivered', value: '10', records: 'builds', changes: ['▲ 25 % on Apr 2026', '= May 2025'] },
      { label: 'Revenue', value: '$1,000', records: 'builds', changes: ['▼ 17 % on Apr 2026', '= May 2025'] },
      // 2 claims over 10 builds against 1 over 8 (12.5) and none over 10.
      { label: 'Claims per 100 builds', value: '20.0', records: 'claims', changes: ['▲ 7.5 points on Apr 2026', '▲ 20.0 points on May 2025'] },
    ]);
  });

  it('leave out revenue the person may not read, and say when there is nothing to compare', () => {
    const key = keyFigures(rollups([sums('2026-05', 3, 0)]))!;
    expect(key.figures.map((f) => f.label)).toEqual(['Builds delivered', 'Claims per 100 builds']);
    expect(key.figures[0]!.changes).toEqual(['▲ from none in Apr 2026', '▲ from none in May 2025']);
    expect(key.figures[1]!.changes).toEqual(['none to compare in Apr 2026', 'none to compare in May 2025']);
  });
});
