import { isoDay, localDay } from '@busbar/calc';
import type { Db } from '@busbar/db';

/** The local day (YYYY-MM-DD) at a location at the UTC instant `at`: the day the roll-ups count a delivery or a claim on. */
export async function localDayAt(db: Db, locationId: number, at: string): Promise<string> {
  const { timeZone } = await db.selectFrom('locations').select('timeZone').where('id', '=', locationId).executeTakeFirstOrThrow();
  return isoDay(localDay(timeZone, Date.parse(at)));
}
