/** A figure with at most `digits` decimals and thousands separators, e.g. 1234.56 → "1,234.6". */
export function figure(value: number, digits = 1): string {
  return value.toLocaleString('en-US', { maximumFractionDigits: digits });
}

/** A typed number as the plan holds it: a cleared field is left out (undefined). */
export function typed(value: unknown): number | undefined {
  return typeof value === 'number' ? value : undefined;
}

/** A percentage field as the plan holds it, a share of 1. */
export function shareOf(percent: unknown): number | undefined {
  return typeof percent === 'number' ? percent / 100 : undefined;
}

/** A share of 1 as a percentage field shows it. */
export function percentOf(share: number | undefined): number | undefined {
  return share === undefined ? undefined : Math.round(share * 1000) / 10;
}

/** A signed figure for balances, e.g. "+4.2" and "−77.7". */
export function signed(value: number, digits = 1): string {
  const shown = figure(Math.abs(value), digits);
  if (shown === '0') return '0';
  return value > 0 ? `+${shown}` : `−${shown}`;
}

/** An hour of the trip as people say it: "day 2, 01:00". */
export function tripMoment(day: number, hour: number): string {
  return `day ${day}, ${String(hour).padStart(2, '0')}:00`;
}
