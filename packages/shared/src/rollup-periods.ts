import { dayOfIso, isoDay } from '@busbar/calc';

export const ROLLUP_GRAINS = ['day', 'week', 'month', 'quarter', 'year'] as const;
export type RollupGrain = (typeof ROLLUP_GRAINS)[number];

/**
 * Periods of a grain, numbered so that the next one is one more: days since 1970-01-01, ISO weeks
 * (Monday first) since the week of 1970-01-01, months, quarters and years since year 0. Keys sort
 * as text within a grain: day YYYY-MM-DD, week the YYYY-MM-DD of its Monday, month YYYY-MM,
 * quarter YYYY-Qn, year YYYY (the summary tables use the same keys, migration 021).
 */
export function periodNumber(grain: RollupGrain, date: string): number {
  const day = dayOfIso(date);
  const [year, month] = date.split('-').map(Number) as [number, number];
  if (grain === 'day') return day;
  // 1970-01-01 was a Thursday: its week began on Monday 1969-12-29, day −3.
  if (grain === 'week') return Math.floor((day + 3) / 7);
  if (grain === 'month') return year * 12 + month - 1;
  if (grain === 'quarter') return year * 4 + Math.floor((month - 1) / 3);
  return year;
}

/** The first day of a period, YYYY-MM-DD. */
export function periodStart(grain: RollupGrain, n: number): string {
  if (grain === 'day') return isoDay(n);
  if (grain === 'week') return isoDay(n * 7 - 3);
  const month = grain === 'month' ? n : grain === 'quarter' ? n * 3 : n * 12;
  return `${String(Math.floor(month / 12)).padStart(4, '0')}-${String((month % 12) + 1).padStart(2, '0')}-01`;
}

/** The last day of a period, YYYY-MM-DD. */
export const periodEnd = (grain: RollupGrain, n: number) => isoDay(dayOfIso(periodStart(grain, n + 1)) - 1);

/** The key of a period as the summary tables store it. */
export function periodKey(grain: RollupGrain, n: number): string {
  const start = periodStart(grain, n);
  if (grain === 'day' || grain === 'week') return start;
  if (grain === 'month') return start.slice(0, 7);
  if (grain === 'quarter') return `${start.slice(0, 4)}-Q${(n % 4) + 1}`;
  return start.slice(0, 4);
}

/**
 * The same period a year before, in periods: a day and a week 52 weeks (364 days) back, so
 * weekdays line up; a month, quarter and year the calendar's own.
 */
export const PERIODS_A_YEAR: Record<RollupGrain, number> = { day: 364, week: 52, month: 12, quarter: 4, year: 1 };

/** How many periods of `grain` from the one holding `from` to the one holding `to`. */
export const periodCount = (grain: RollupGrain, from: string, to: string) => periodNumber(grain, to) - periodNumber(grain, from) + 1;

/**
 * The months from `from` to `to` (YYYY-MM, inclusive) as the fewest whole years, quarters and
 * months, in order: the summary tables keep each year and quarter summed already, so a sum over
 * the months reads one row where it would read twelve or three.
 */
export function fewestPeriods(from: string, to: string): { grain: 'year' | 'quarter' | 'month'; key: string }[] {
  const periods: { grain: 'year' | 'quarter' | 'month'; key: string }[] = [];
  const last = periodNumber('month', `${to}-01`);
  for (let month = periodNumber('month', `${from}-01`); month <= last; ) {
    const grain = month % 12 === 0 && month + 11 <= last ? 'year' : month % 3 === 0 && month + 2 <= last ? 'quarter' : 'month';
    const length = grain === 'year' ? 12 : grain === 'quarter' ? 3 : 1;
    periods.push({ grain, key: periodKey(grain, month / length) });
    month += length;
  }
  return periods;
}
