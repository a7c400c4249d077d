import type { ComparedFigure, ComparedFigures, LocationComparison } from '@busbar/shared';
/** How the network screens write counts, whole dollars and tenths. */
export const whole = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });
export const tenth = new Intl.NumberFormat('en-US', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
export const dollars = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD', maximumFractionDigits: 0 });
const share = (value: number) => `${tenth.format(value * 100)} %`;

/** The compared figures in the order the table shows them, each with its heading and format. */
export const FIGURES: { key: ComparedFigure; title: string; format: (value: number) => string }[] = [
  { key: 'buildsDelivered', title: 'Builds delivered', format: (v) => whole.format(v) },
  { key: 'revenueCents', title: 'Revenue', format: (v) => dollars.format(v / 100) },
  { key: 'averageTicketCents', title: 'Average ticket', format: (v) => dollars.format(v / 100) },
  { key: 'grossMarginShare', title: 'Gross margin', format: share },
  { key: 'laborHoursPerBuild', title: 'Labor hours per build', format: (v) => tenth.format(v) },
  { key: 'claimsPer100Builds', title: 'Claims per 100 builds', format: (v) => tenth.format(v) },
  { key: 'warrantyCostShare', title: 'Warranty cost, share of revenue', format: share },
];

/** The figures the person reads: money they may not read is not in the answer at all. */
export const shownFigures = (answer: LocationComparison) => FIGURES.filter((f) => f.key in answer.median);

/** A figure in words, or null where there is none (no delivered build to divide by). */
export function figureText(figures: ComparedFigures, key: ComparedFigure): string | null {
  const value = figures[key];
  return value === null || value === undefined ? null : FIGURES.find((f) => f.key === key)!.format(value);
}

/** How a mark reads, in a word and a shape, and why it was given. */
export function markOf(key: ComparedFigure, side: 'high' | 'low'): { text: string; reason: string } {
  const shape = side === 'high' ? '▲' : '▼';
  if (key === 'claimsPer100Builds') {
    return {
      text: `${shape} ${side === 'high' ? 'Above' : 'Below'} the funnel`,
      reason: `${side === 'high' ? 'More' : 'Fewer'} claims than the network's rate explains by chance at this many builds (outside the 99.8 % funnel limit).`,
    };
  }
  return {
    text: `${shape} Far ${side === 'high' ? 'above' : 'below'}`,
    reason: `Far ${side === 'high' ? 'above' : 'below'} the network's median: further than 3.5 robust standard deviations (a modified z-score).`,
  };
}

/** Rows ordered by a figure, highest first or lowest first; rows without the figure go last either way. */
export function sortedBy<T extends { figures: ComparedFigures }>(rows: T[], key: ComparedFigure, order: 'ascend' | 'descend'): T[] {
  const sign = order === 'ascend' ? 1 : -1;
  const value = (r: T) => r.figures[key];
  return [...rows].sort((a, b) => {
    const [x, y] = [value(a), value(b)];
    if (x === null || x === undefined) return y === null || y === undefined ? 0 : 1;
    if (y === null || y === undefined) return -1;
    return sign * (x - y);
  });
}
