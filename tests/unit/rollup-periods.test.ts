import { ROLLUP_GRAINS, PERIODS_A_YEAR, periodEnd, periodKey, periodNumber, periodStart } from '@busbar/shared';
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
});
