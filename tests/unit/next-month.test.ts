import { describe, expect, it } from 'vitest';
import { monthsFrom, nextMonth } from '../../apps/api/src/queries/month-finals.ts';

/** The month after a YYYY-MM month as JavaScript's calendar rolls it over (month 12 of a year is January of the next). */
const byCalendar = (month: string) => new Date(Date.UTC(Number(month.slice(0, 4)), Number(month.slice(5, 7)), 1)).toISOString().slice(0, 7);

describe('months of the close', () => {
  it('follow every month with the one the calendar gives, across years, for a century', () => {
    let checked = 0;
    for (let year = 1999; year <= 2100; year++) {
      for (let m = 1; m <= 12; m++) {
        const month = `${year}-${String(m).padStart(2, '0')}`;
        expect(nextMonth(month)).toBe(byCalendar(month));
        checked++;
      }
    }
    expect(checked).toBe(1224);
    expect(nextMonth('2026-12')).toBe('2027-01');
  });

  it('list a range in order, both ends included, and none when it ends before it starts', () => {
    expect(monthsFrom('2025-11', '2026-02')).toEqual(['2025-11', '2025-12', '2026-01', '2026-02']);
    expect(monthsFrom('2026-03', '2026-03')).toEqual(['2026-03']);
    expect(monthsFrom('2026-03', '2026-02')).toEqual([]);
  });
});
