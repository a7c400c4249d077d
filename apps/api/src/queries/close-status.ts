import type { Db } from '@busbar/db';
import type { CloseCellStatus, CloseStatus } from '@busbar/shared';
import type { LocationScope } from '../access/locations.ts';
import { monthAt, placesIn } from './month-close.ts';
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
  // A few zones cover the network: each zone's month today is worked out once (the zone database is slow to ask).
  const monthNow = new Map<string, string>();
  const hasEnded = (timeZone: string, month: string) => {
    if (!monthNow.has(timeZone)) monthNow.set(timeZone, monthAt(timeZone, now));
    return monthNow.get(timeZone)! > month;
  };
  const statusOf = (locationId: number, timeZone: string, next: string | null, month: string): CloseCellStatus => {
    if (final.has(`${locationId} ${month}`)) return 'final';
    if (!hasEnded(timeZone, month)) return 'running';
    return !next || next === month ? 'next' : 'open';
  };
  return {
    months,
    locations: rows.map((l) => {
      // Each shop's next month to close, once (not once a cell).
      const lastFinal = last.get(l.id);
      const next = lastFinal ? nextMonth(lastFinal) : null;
      return { locationId: l.id, cells: months.map((m) => statusOf(l.id, l.timeZone, next, m)) };
    }),
  };
}
