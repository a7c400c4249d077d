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
