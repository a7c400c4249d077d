import type { LocationQuery } from 'vue-router';

/** The month ranges the comparison offers, each ending with the last whole month (or this month, so far). */
export const MONTH_RANGES = [
  { value: '3', label: 'Last 3 months', months: 3, current: false },
  { value: '6', label: 'Last 6 months', months: 6, current: false },
  { value: '12', label: 'Last 12 months', months: 12, current: false },
  { value: 'year', label: 'This year so far', months: 0, current: true },
] as const;
export type MonthRange = (typeof MONTH_RANGES)[number]['value'];
export const DEFAULT_RANGE: MonthRange = '12';

/** YYYY-MM of the month `offset` months after `month`. */
export function addMonths(month: string, offset: number): string {
  const n = Number(month.slice(0, 4)) * 12 + Number(month.slice(5)) - 1 + offset;
  return `${Math.floor(n / 12)}-${String((n % 12) + 1).padStart(2, '0')}`;
}

/** The first and last month (YYYY-MM) of a range, as of `today` (YYYY-MM-DD). */
export function monthsOf(range: MonthRange, today: string): { from: string; to: string } {
  const thisMonth = today.slice(0, 7);
  if (range === 'year') return { from: `${today.slice(0, 4)}-01`, to: thisMonth };
  const { months } = MONTH_RANGES.find((r) => r.value === range)!;
  const to = addMonths(thisMonth, -1);
  return { from: addMonths(to, 1 - months), to };
}

/** The range the address bar holds, or the default. */
export function readRange(query: LocationQuery): MonthRange {
  return MONTH_RANGES.find((r) => r.value === query.months)?.value ?? DEFAULT_RANGE;
}

/** The last day (YYYY-MM-DD) of a month (YYYY-MM). */
export function lastDayOf(month: string): string {
  const next = addMonths(month, 1);
  const day = new Date(Date.UTC(Number(next.slice(0, 4)), Number(next.slice(5)) - 1, 0)).getUTCDate();
  return `${month}-${String(day).padStart(2, '0')}`;
}

const MONTH_NAMES = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
/** "Jun 2025" */
export const monthName = (month: string) => `${MONTH_NAMES[Number(month.slice(5)) - 1]} ${month.slice(0, 4)}`;
