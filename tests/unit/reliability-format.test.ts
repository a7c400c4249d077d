import { describe, expect, it } from 'vitest';
import type { ReliabilityRow } from '@busbar/shared';
import { differsFromNetwork, reliabilityColumns } from '../../apps/web/src/views/reliability/reliabilityColumns.ts';
import { filterQuery, readGroupBy, readReliabilityFilter } from '../../apps/web/src/views/reliability/reliabilityFilters.ts';
import { count, monthRange, percent, rate, rateWithInterval, shareWithInterval, times } from '../../apps/web/src/views/reliability/reliabilityFormat.ts';

describe('reliability figures in words', () => {
  it('gives a rate with its limits, decimals by size', () => {
    expect(rateWithInterval({ estimate: 1.8, lower: 1.2, upper: 2.6 })).toBe('1.8 (1.2–2.6)');
    expect(rateWithInterval({ estimate: 0.31, lower: 0.12, upper: 0.64 })).toBe('0.31 (0.12–0.64)');
    expect(rateWithInterval({ estimate: 0, lower: 0, upper: 3.69 })).toBe('0.0 (0.0–3.7)');
    expect(rateWithInterval({ estimate: 140.2, lower: 98.7, upper: 195.5 })).toBe('140 (99–196)');
    expect(rateWithInterval(null)).toBe('—');
  });

  it('gives a share with its limits as percent', () => {
    expect(shareWithInterval({ estimate: 0.123, lower: 0.081, upper: 0.18 })).toBe('12 % (8–18 %)');
    expect(shareWithInterval({ estimate: 0.042, lower: 0.021, upper: 0.079 })).toBe('4.2 % (2.1–7.9 %)');
    expect(shareWithInterval(null)).toBe('—');
    expect([percent(0.5), percent(0.05), count(12_480.4), times(3.42), times(12.4)]).toEqual(['50 %', '5.0 %', '12,480', '3.4×', '12×']);
    expect([rate(0), rate(0.314), rate(6.25), rate(140.2)]).toEqual(['0', '0.31', '6.3', '140']);
    expect([monthRange('2024-07', '2024-09'), monthRange('2025-12', '2026-02'), monthRange('2026-01', '2026-01')]).toEqual(['Jul 2024 – Sep 2024', 'Dec 2025 – Feb 2026', 'Jan 2026']);
  });
});

describe('reliability filters in the address bar', () => {
  it('reads months and shops, dropping what is not one', () => {
    expect(readReliabilityFilter({ from: '2025-03', to: '2026-01', locations: '4,2,4,x,-1' })).toEqual({ from: '2025-03', to: '2026-01', locationIds: [4, 2] });
    expect(readReliabilityFilter({ from: '2025-13', to: ['2026-01'], locations: null })).toEqual({ from: undefined, to: undefined, locationIds: [] });
    // A range the wrong way round keeps its start.
    expect(readReliabilityFilter({ from: '2026-02', to: '2025-01' })).toEqual({ from: '2026-02', to: undefined, locationIds: [] });
  });

  it('writes back only what is set, and reads a grouping or falls back to items', () => {
    expect(filterQuery({ from: '2025-03', to: undefined, locationIds: [4, 2] })).toEqual({ from: '2025-03', locations: '4,2' });
    expect(filterQuery({ locationIds: [] })).toEqual({});
    expect([readGroupBy('vendor'), readGroupBy('category'), readGroupBy('shop'), readGroupBy(undefined)]).toEqual(['vendor', 'category', 'item', 'item']);
  });
});

describe('reliability list columns', () => {
  const interval = (estimate: number, upper: number) => ({ estimate, lower: 0, upper });
  const row = (rate: number, networkRate: number, units = 10): ReliabilityRow => ({
    key: '1',
    label: 'LKS-LFP100',
    category: 'house_battery',
    units,
    unitMonths: 100,
    failures: 1,
    rate: interval(rate, 9),
    warranty: null,
    networkRate: interval(networkRate, 9),
  });

  it("adds the network's rate only where it differs from the rows' own, before the warranty share", () => {
    expect(differsFromNetwork([row(2, 2), row(1, 1)])).toBe(false);
    expect(differsFromNetwork([row(2, 2), row(3, 1)])).toBe(true);
    expect(differsFromNetwork([row(2, 2), { ...row(3, 1, 0), rate: null }])).toBe(false);
    const keys = (network: boolean) => (reliabilityColumns('item', { narrow: false, network }) as { key: string }[]).map((c) => c.key);
    expect(keys(false)).toEqual(['label', 'units', 'unitMonths', 'failures', 'rate', 'warranty']);
    expect(keys(true)).toEqual(['label', 'units', 'unitMonths', 'failures', 'rate', 'networkRate', 'warranty']);
    expect((reliabilityColumns('vendor', { narrow: true, network: true }) as { key: string; title: string }[]).map((c) => [c.key, c.title])).toEqual([
      ['summary', 'Vendor and failures per 1,000 unit-months'],
    ]);
  });

  it('sorts by a figure with rows that have none below every figure', () => {
    const rate = (reliabilityColumns('item', { narrow: false, network: false }) as { key: string; sorter: (a: ReliabilityRow, b: ReliabilityRow) => number }[]).find((c) => c.key === 'rate')!;
    const rows = [row(3, 1), { ...row(0, 1), rate: null }, row(0, 1), row(1.5, 1)];
    expect([...rows].sort(rate.sorter).map((r) => r.rate?.estimate ?? null)).toEqual([null, 0, 1.5, 3]);
  });
});
