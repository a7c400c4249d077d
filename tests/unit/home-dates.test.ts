import { describe, expect, it } from 'vitest';
import { sortedBy } from '../../apps/web/src/views/network/comparedFigures.ts';
import { mondayOf, weekFrom } from '../../apps/web/src/views/home/shopWeek.ts';
import { addMonths, lastDayOf, monthsOf, readRange } from '../../apps/web/src/views/network/comparedMonths.ts';

describe('the months a comparison covers', () => {
  it('ends the last N months with the last whole month, across a year boundary', () => {
    expect(monthsOf('12', '2026-06-15')).toEqual({ from: '2025-06', to: '2026-05' });
    expect(monthsOf('3', '2026-01-02')).toEqual({ from: '2025-10', to: '2025-12' });
    expect(monthsOf('6', '2026-12-31')).toEqual({ from: '2026-06', to: '2026-11' });
  });

  it('takes this year so far from January to the current month', () => {
    expect(monthsOf('year', '2026-01-05')).toEqual({ from: '2026-01', to: '2026-01' });
    expect(monthsOf('year', '2026-12-03')).toEqual({ from: '2026-01', to: '2026-12' });
  });

  it('ends each month on its last day: thirty days hath September, and February 29 in leap years', () => {
    const leap = (year: number) => (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
    for (let offset = -60; offset <= 60; offset++) {
      const month = addMonths('2024-02', offset);
      const [year, m] = [Number(month.slice(0, 4)), Number(month.slice(5))];
      const days = [31, leap(year) ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][m - 1]!;
      expect(lastDayOf(month)).toBe(`${month}-${days}`);
    }
    expect(lastDayOf('2100-02')).toBe('2100-02-28');
    expect(lastDayOf('2000-02')).toBe('2000-02-29');
  });

  it('reads an unknown range from the address bar as the last 12 months', () => {
    expect(readRange({ months: '6' })).toBe('6');
    expect(readRange({ months: '24' })).toBe('12');
    expect(readRange({})).toBe('12');
  });
});

describe('ordering the shops', () => {
  const rows = [
    { code: 'A', figures: { buildsDelivered: 5, claimsOpened: 1, claimsPer100Builds: 20 } },
    { code: 'B', figures: { buildsDelivered: 0, claimsOpened: 0, claimsPer100Builds: null } },
    { code: 'C', figures: { buildsDelivered: 50, claimsOpened: 1, claimsPer100Builds: 2 } },
  ];
  it('puts shops without the figure last, whichever way the order goes', () => {
    expect(sortedBy(rows, 'claimsPer100Builds', 'descend').map((r) => r.code)).toEqual(['A', 'C', 'B']);
    expect(sortedBy(rows, 'claimsPer100Builds', 'ascend').map((r) => r.code)).toEqual(['C', 'A', 'B']);
  });
});

describe("a shop's week", () => {
  // Weekdays as GNU date names them (date -d 2026-12-03 +%A: Thursday).
  it('counts deliveries from the Monday of the week, across month and year ends', () => {
    expect(mondayOf('2026-12-03')).toBe('2026-11-30');
    expect(mondayOf('2026-11-30')).toBe('2026-11-30');
    expect(mondayOf('2026-12-06')).toBe('2026-11-30');
    expect(mondayOf('2027-01-01')).toBe('2026-12-28');
    expect(mondayOf('2024-02-29')).toBe('2024-02-26');
  });

  it('books the next seven days from today, through the end of a leap February', () => {
    expect(weekFrom('2024-02-26')).toEqual(['2024-02-26', '2024-02-27', '2024-02-28', '2024-02-29', '2024-03-01', '2024-03-02', '2024-03-03']);
  });
});
