import { describe, expect, it } from 'vitest';
import { filterQuery, readGroupBy, readReliabilityFilter } from '../../apps/web/src/views/reliability/reliabilityFilters.ts';
import { count, percent, rate, rateWithInterval, shareWithInterval, times } from '../../apps/web/src/views/reliability/reliabilityFormat.ts';

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
