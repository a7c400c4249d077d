import { fewestPeriods, ROLLUP_GRAINS, PERIODS_A_YEAR, periodEnd, periodKey, periodNumber, periodStart } from '@busbar/shared';
import { describe, expect, it } from 'vitest';
import { keyOf } from '../support/rollup-direct.ts';

const DAY_MS = 86_400_000;
const days = Array.from({ length: 366 * 12 }, (_, i) => new Date(Date.UTC(2019, 0, 1) + i * DAY_MS).toISOString().slice(0, 10));

describe('roll-up periods', () => {
  it.each(ROLLUP_GRAINS)('number every day of twelve years into the %s Date puts it in, which starts on or before it and ends on or after it', (grain) => {
    for (const day of days) {
      const n = periodNumber(grain, day);
      expect(periodKey(grain, n)).toBe(keyOf(grain, day));
      expect(periodStart(grain, n) <= day && day <= periodEnd(grain, n)).toBe(true);
      expect(periodStart(grain, n + 1)).toBe(new Date(Date.parse(periodEnd(grain, n)) + DAY_MS).toISOString().slice(0, 10));
    }
  });

  it('cuts ISO weeks from Monday, across the new year, and a week of 53', () => {
    const week = (day: string) => periodKey('week', periodNumber('week', day));
    expect([week('2025-12-29'), week('2026-01-01'), week('2026-01-04'), week('2026-01-05')]).toEqual(['2025-12-29', '2025-12-29', '2025-12-29', '2026-01-05']);
    // 2020 had 53 ISO weeks: its last began on Monday 28 December and ran into 2021.
    expect([week('2020-12-28'), week('2021-01-03')]).toEqual(['2020-12-28', '2020-12-28']);
    expect(periodEnd('week', periodNumber('week', '2020-12-28'))).toBe('2021-01-03');
  });

  it('compares a day and a week with 364 days before (the same weekday), a month, quarter and year with the calendar', () => {
    const back = (grain: (typeof ROLLUP_GRAINS)[number], day: string) => periodKey(grain, periodNumber(grain, day) - PERIODS_A_YEAR[grain]);
    expect(back('day', '2026-03-02')).toBe('2025-03-03');
    expect(back('week', '2026-03-02')).toBe('2025-03-03');
    expect(back('month', '2026-03-02')).toBe('2025-03');
    expect(back('quarter', '2026-03-02')).toBe('2025-Q1');
    expect(back('year', '2026-03-02')).toBe('2025');
    expect(periodKey('quarter', periodNumber('quarter', '2026-01-15') - 1)).toBe('2025-Q4');
  });

  it('makes every range of months of three years of the fewest whole years, quarters and months, each month once and in order', () => {
    const months = Array.from({ length: 36 }, (_, i) => `${2024 + Math.floor(i / 12)}-${String((i % 12) + 1).padStart(2, '0')}`);
    // Read back from the keys alone: YYYY is twelve months, YYYY-Qn three, YYYY-MM one.
    const monthsOfKey = (key: string) => {
      if (/^\d{4}$/.test(key)) return months.filter((m) => m.startsWith(key));
      const quarter = /^(\d{4})-Q([1-4])$/.exec(key);
      if (quarter) return [1, 2, 3].map((k) => `${quarter[1]}-${String((Number(quarter[2]) - 1) * 3 + k).padStart(2, '0')}`);
      return [key];
    };
    for (let from = 0; from < months.length; from++) {
      for (let to = from; to < months.length; to++) {
        const periods = fewestPeriods(months[from]!, months[to]!);
        expect(periods.flatMap((p) => monthsOfKey(p.key))).toEqual(months.slice(from, to + 1));
        expect(periods.every((p) => p.grain === (p.key.length === 4 ? 'year' : p.key.includes('Q') ? 'quarter' : 'month'))).toBe(true);
        // Fewest: no whole calendar year of the range is cut into quarters or months, no whole quarter into months.
        const loose = periods.filter((p) => p.grain === 'month').map((p) => p.key);
        for (let q = 0; q < 12; q++) expect([0, 1, 2].every((k) => loose.includes(months[q * 3 + k]!))).toBe(false);
        const quarters = periods.filter((p) => p.grain === 'quarter').map((p) => p.key.slice(0, 4));
        for (const year of ['2024', '2025', '2026']) expect(quarters.filter((y) => y === year).length).toBeLessThan(4);
      }
    }
    expect(fewestPeriods('2025-12', '2026-11').map((p) => p.key)).toEqual(['2025-12', '2026-Q1', '2026-Q2', '2026-Q3', '2026-10', '2026-11']);
    expect(fewestPeriods('2025-01', '2025-12')).toEqual([{ grain: 'year', key: '2025' }]);
  });
});
