import { addMonthsIso } from '@busbar/calc';
import { openDatabase, type Db } from '@busbar/db';
import { sql } from 'kysely';
import { finalizeMonth } from './queries/month-close.ts';
import { monthsFrom, nextMonth } from './queries/month-finals.ts';

const ACCOUNTANT = 'accountant@demo.busbar.test';
/** The demo's accountant marks a month final on this day of the month after, at 17:00 UTC (morning in the shops). */
const CLOSING_DAY = '10';

/**
 * The month closes a network's accountant would have made by `now`: at every location, each month
 * from its first delivery through the month before last, marked final in order on the 10th of the
 * month after; last month stays open for the accountant to close. Made through the app's own
 * `finalizeMonth`, so the figures, the carried sums and the audit log are as a close writes them.
 * `onClose` is told after each (for a progress bar). Answers how many months were closed.
 */
export async function closeDemoMonths(db: Db, now: Date, onClose: (done: number, of: number) => void = () => {}): Promise<number> {
  const accountant = await db.selectFrom('users').select('id').where('email', '=', ACCOUNTANT).executeTakeFirst();
  if (!accountant) return 0;
  // The month before last has ended in every zone by now.
  const lastToClose = addMonthsIso(`${now.toISOString().slice(0, 7)}-01`, -2).slice(0, 7);
  const locations = await db
    .selectFrom('locations as l')
    .innerJoin('builds as b', 'b.locationId', 'l.id')
    .where('b.status', '=', 'delivered')
    .groupBy('l.id')
    .select(['l.id', 'l.name', 'l.timeZone', sql<string>`substr(min(b.delivered_on), 1, 7)`.as('firstMonth')])
    .execute();
  const of = locations.reduce((n, l) => n + monthsFrom(l.firstMonth, lastToClose).length, 0);
  let done = 0;
  for (const location of locations) {
    for (const month of monthsFrom(location.firstMonth, lastToClose)) {
      await finalizeMonth(db, location, month, { id: accountant.id, at: new Date(`${nextMonth(month)}-${CLOSING_DAY}T17:00:00.000Z`) });
      onClose(++done, of);
    }
  }
  return done;
}

/** closeDemoMonths on the database of a generated network in `file`. */
export async function closeGeneratedMonths(file: string, now: Date, onClose: (done: number, of: number) => void): Promise<number> {
  const db = openDatabase(file);
  try {
    return await closeDemoMonths(db, now, onClose);
  } finally {
    await db.destroy();
  }
}
