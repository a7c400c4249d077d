import type { Db } from '@busbar/db';
import type { CloseCellStatus, CloseStatus } from '@busbar/shared';
import type { LocationScope } from '../access/locations.ts';
import { endedAt, placesIn } from './month-close.ts';
import { lastFinals, monthsFrom, nextMonth } from './month-finals.ts';

/**
 * Where each location of `scope` stands with each month from `from` to `to`: final, running (not
 * ended in its zone: it cannot be marked yet, even as the next), next to close, or open. Reads only
 * the locations and their final months, never builds or claims.
 */
export async function closeStatus(db: Db, from: string, to: string, scope: LocationScope, now: Date): Promise<CloseStatus> {
  const months = monthsFrom(from, to);
  let finals = db.selectFrom('monthCloses').select(['locationId', 'month']).where('month', '>=', from).where('month', '<=', to);
  if (scope !== 'all') finals = finals.where('locationId', 'in', scope.length > 0 ? scope : [0]);
  const [rows, finalRows, last] = [await placesIn(db, scope), await finals.execute(), await lastFinals(db, scope)];
  const final = new Set(finalRows.map((f) => `${f.locationId} ${f.month}`));
  // A few zones cover the network: each zone's answer for a month is worked out once.
  const ended = new Map<string, boolean>();
  const hasEnded = (timeZone: string, month: string) => {
    const key = `${timeZone} ${month}`;
    if (!ended.has(key)) ended.set(key, endedAt(timeZone, month, now));
    return ended.get(key)!;
  };
  const statusOf = (locationId: number, timeZone: string, month: string): CloseCellStatus => {
    if (final.has(`${locationId} ${month}`)) return 'final';
    if (!hasEnded(timeZone, month)) return 'running';
    const lastFinal = last.get(locationId);
    return !lastFinal || nextMonth(lastFinal) === month ? 'next' : 'open';
  };
  return { months, locations: rows.map((l) => ({ locationId: l.id, cells: months.map((m) => statusOf(l.id, l.timeZone, m)) })) };
}
