import { ROLE_LABELS, type AssignmentView } from '@busbar/shared';
import dayjs from 'dayjs';

/** A moment in the viewer's own time zone, e.g. "Mar 4, 2025, 2:05 PM". */
export function formatDateTime(iso: string | null, empty = '—'): string {
  return iso ? dayjs(iso).format('MMM D, YYYY, h:mm A') : empty;
}

/** Where an assignment applies, in words: a shop, a region or the whole network. */
export function scopeLabel(a: AssignmentView): string {
  if (a.scope === 'location') return [a.locationCode, a.locationName].filter(Boolean).join(' ') || 'A location';
  if (a.scope === 'region') return a.regionName ? `${a.regionName} region` : 'A region';
  return 'Whole network';
}

/** "Technician · DEN1 Denver East" */
export function assignmentLabel(a: AssignmentView): string {
  return `${ROLE_LABELS[a.role]} · ${scopeLabel(a)}`;
}

const dollars = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' });

/** Integer cents as dollars, e.g. 123456 → "$1,234.56". */
export function formatMoney(cents: number): string {
  return dollars.format(cents / 100);
}

/** A rate in basis points as a percentage, e.g. 650 → "6.5 %". */
export function formatBasisPoints(basisPoints: number): string {
  return `${(basisPoints / 100).toLocaleString('en-US', { maximumFractionDigits: 2 })} %`;
}

/** A calendar date (YYYY-MM-DD), or the viewer's day of a moment, in words, e.g. "Jun 20, 2026". */
export function formatDate(isoDate: string | null, empty = '—'): string {
  return isoDate ? dayjs(isoDate).format('MMM D, YYYY') : empty;
}

/** Hours with at most two decimals, e.g. 6.5 → "6.5 h". */
export function formatHours(hours: number): string {
  return `${Number(hours.toFixed(2))} h`;
}

/** Date pickers show "Jun 20, 2026" and also take a typed ISO date (2026-06-20). */
export const DATE_FORMATS = ['MMM D, YYYY', 'YYYY-MM-DD'];
