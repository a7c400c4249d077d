import type { Interval } from '@busbar/shared';

const number = (value: number, digits: number) => value.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits });

/** Decimals enough to tell small rates apart without false precision. */
const rateDigits = (value: number) => (value < 1 ? 2 : value < 100 ? 1 : 0);

/** A count or unit-months as a whole number, e.g. "12,480". */
export const count = (value: number) => number(Math.round(value), 0);

/** A rate per 1,000 unit-months, e.g. "1.8"; none at all is "0". */
export const rate = (value: number) => (value === 0 ? '0' : number(value, rateDigits(value)));

/** A rate with its limits, e.g. "1.8 (1.2–2.6)"; "—" without time in service. */
export function rateWithInterval(interval: Interval | null): string {
  if (!interval) return '—';
  const digits = rateDigits(interval.upper);
  return `${number(interval.estimate, digits)} (${number(interval.lower, digits)}–${number(interval.upper, digits)})`;
}

/** A share of 1 as a percentage, e.g. 0.123 → "12 %". */
export function percent(share: number, digits = share < 0.1 ? 1 : 0): string {
  return `${number(share * 100, digits)} %`;
}

/** A share with its limits as percentages, e.g. "4.2 % (2.1–7.9 %)"; "—" when none. */
export function shareWithInterval(interval: Interval | null): string {
  if (!interval) return '—';
  const digits = interval.upper < 0.1 ? 1 : 0;
  return `${number(interval.estimate * 100, digits)} % (${number(interval.lower * 100, digits)}–${number(interval.upper * 100, digits)} %)`;
}

const monthNames = new Intl.DateTimeFormat('en-US', { month: 'short', year: 'numeric', timeZone: 'UTC' });

/** Install months "2024-07" to "2024-09" in words: "Jul 2024 – Sep 2024"; one month alone: "Jul 2024". */
export function monthRange(from: string, to: string): string {
  const month = (ym: string) => monthNames.format(Date.UTC(Number(ym.slice(0, 4)), Number(ym.slice(5, 7)) - 1, 1));
  return from === to ? month(from) : `${month(from)} – ${month(to)}`;
}

/** A ratio to peers, e.g. "3.4×". */
export const times = (ratio: number) => `${number(ratio, ratio < 10 ? 1 : 0)}×`;
