import type { Rollups } from '@busbar/shared';
import { dollars, tenth, whole } from './comparedFigures.ts';
import { monthName } from './comparedMonths.ts';

/** The person's shops together in one month. */
interface MonthSums {
  delivered: number;
  revenueCents: number | null;
  claims: number;
}

export interface KeyFigure {
  label: string;
  value: string;
  /** The records behind the figure: the month's delivered builds, or its logged claims. */
  records: 'builds' | 'claims';
  /** Against the month before and the same month a year before, in words with a shape (▲ ▼ =). */
  changes: string[];
}


function sumsOf(rollups: Rollups, period: string): MonthSums {
  const sums = rollups.scope.find((s) => s.period === period);
  // A month with nothing has no sums: none of anything, and revenue where the person reads it in other months.
  const money = (sums ?? rollups.scope[0])?.revenueCents !== undefined;
  return { delivered: sums?.buildsDelivered ?? 0, revenueCents: money ? (sums?.revenueCents ?? 0) : null, claims: sums?.claimsOpened ?? 0 };
}

const per100 = (s: MonthSums) => (s.delivered > 0 ? (s.claims * 100) / s.delivered : null);

/** "▲ 12 % on Oct 2026", "▼ 3 % on Nov 2025", "= Oct 2026"; nothing to compare with says so. */
function percentChange(now: number | null, then: number | null, month: string): string {
  if (now === null || then === null) return `none to compare in ${monthName(month)}`;
  if (then === 0) return now === 0 ? `= ${monthName(month)}` : `▲ from none in ${monthName(month)}`;
  const change = Math.round(((now - then) / then) * 100);
  return change === 0 ? `= ${monthName(month)}` : `${change > 0 ? '▲' : '▼'} ${Math.abs(change)} % on ${monthName(month)}`;
}

/** Claims per 100 builds change in points, not percent: "▲ 2.5 points on Oct 2026". */
function pointChange(now: number | null, then: number | null, month: string): string {
  if (now === null || then === null) return `none to compare in ${monthName(month)}`;
  const change = Math.round((now - then) * 10) / 10;
  return change === 0 ? `= ${monthName(month)}` : `${change > 0 ? '▲' : '▼'} ${tenth.format(Math.abs(change))} points on ${monthName(month)}`;
}

/**
 * The last month of a monthly roll-up for the person's shops together: builds delivered, revenue
 * (when the person reads it), claims per 100 builds, each against the month before and the same
 * month a year before.
 */
export function keyFigures(rollups: Rollups): { month: string; start: string; end: string; figures: KeyFigure[] } | null {
  const last = rollups.periods.at(-1);
  if (!last) return null;
  const [now, before, yearBefore] = [last.period, last.previous, last.lastYear].map((p) => sumsOf(rollups, p)) as [MonthSums, MonthSums, MonthSums];
  const figures: KeyFigure[] = [
    {
      label: 'Builds delivered',
      value: whole.format(now.delivered),
      records: 'builds',
      changes: [percentChange(now.delivered, before.delivered, last.previous), percentChange(now.delivered, yearBefore.delivered, last.lastYear)],
    },
  ];
  if (now.revenueCents !== null) {
    figures.push({
      label: 'Revenue',
      value: dollars.format(now.revenueCents / 100),
      records: 'builds',
      changes: [percentChange(now.revenueCents, before.revenueCents, last.previous), percentChange(now.revenueCents, yearBefore.revenueCents, last.lastYear)],
    });
  }
  const rate = per100(now);
  figures.push({
    label: 'Claims per 100 builds',
    value: rate === null ? '—' : tenth.format(rate),
    records: 'claims',
    changes: [pointChange(rate, per100(before), last.previous), pointChange(rate, per100(yearBefore), last.lastYear)],
  });
  return { month: last.period, start: last.start, end: last.end, figures };
}
