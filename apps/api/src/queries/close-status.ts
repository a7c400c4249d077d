import type { Db } from '@busbar/db';
import type { CloseCellStatus, CloseStatus } from '@busbar/shared';
import { sql } from 'kysely';
import type { LocationScope } from '../access/locations.ts';
import { monthAt } from './month-close.ts';
import { LAST_FINAL, monthsFrom, nextMonth } from './month-finals.ts';

/**
 * Where each location of `scope` stands with each month from `from` to `to`: final, running (not
 * ended in its zone: it cannot be marked yet, even as the next), next to close, or open. Reads only
 * the locations and their final months, never builds or claims.
 */
export async function closeStatus(db: Db, from: string, to: string, scope: LocationScope, now: Date): Promise<CloseStatus> {
  const months = monthsFrom(from, to);
  // Each shop with its final months of the range and its last final month: a row per shop (two
  // seeks), not a row per final month.
  let query = db
    .selectFrom('locations as l')
    .select([
      'l.id',
      'l.timeZone',
      sql<string | null>`(select group_concat(c.month) from month_closes c where c.location_id = l.id and c.month between ${from} and ${to})`.as('finals'),
      LAST_FINAL.as('lastFinal'),
    ])
    .orderBy('l.code');
  if (scope !== 'all') query = query.where('l.id', 'in', scope.length > 0 ? scope : [0]);
  const rows = await query.execute();
  // A few zones cover the network: each zone's month today is worked out once (the zone database is slow to ask).
  const monthNow = new Map<string, string>();
  const hasEnded = (timeZone: string, month: string) => {
    if (!monthNow.has(timeZone)) monthNow.set(timeZone, monthAt(timeZone, now));
    return monthNow.get(timeZone)! > month;
  };
  const statusOf = (finals: Set<string>, timeZone: string, next: string | null, month: string): CloseCellStatus => {
    if (finals.has(month)) return 'final';
    if (!hasEnded(timeZone, month)) return 'running';
    return !next || next === month ? 'next' : 'open';
  };
  return {
    months,
    locations: rows.map((l) => {
      // Each shop's final months and next month to close, once (not once a cell).
      const [finals, next] = [new Set(l.finals?.split(',')), l.lastFinal ? nextMonth(l.lastFinal) : null];
      return { locationId: l.id, cells: months.map((m) => statusOf(finals, l.timeZone, next, m)) };
    }),
  };
}
