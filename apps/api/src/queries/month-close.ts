import { isoDay, localDay } from '@busbar/calc';
import type { Db } from '@busbar/db';
import type { LocationClose, MonthClose, MonthCloseFigures } from '@busbar/shared';
import type { LocationScope } from '../access/locations.ts';
import { conflict, invalidField } from '../errors.ts';
import { writeAudit } from './audit.ts';
import { FIGURES, liveCloses, type LiveClose } from './month-close-figures.ts';
import { adjustmentsOf, carriedNow, driftsOf, finalsIn, LAST_FINAL, lastFinals, nextMonth } from './month-finals.ts';

const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];
/** A month (YYYY-MM) in words: "March 2026". */
export const inWords = (month: string) => `${MONTHS[Number(month.slice(5)) - 1]} ${month.slice(0, 4)}`;
/** The month (YYYY-MM) it is in a time zone at `now`. */
export const monthAt = (timeZone: string, now: Date) => isoDay(localDay(timeZone, now.getTime())).slice(0, 7);
/** Whether the month has ended at a location by `now`: its local today lies past the month's last day. */
export const endedAt = (timeZone: string, month: string, now: Date) => monthAt(timeZone, now) > month;

/**
 * The month at each location of `scope`: as closed where it is final, else as it stands now (the
 * final ones' builds and claims are not summed again); the next month to close at a location (the
 * month after its last final one) takes up the changes made since to its final months, as adjustments.
 */
export async function monthClose(db: Db, month: string, scope: LocationScope, now: Date): Promise<MonthClose> {
  const [places, finals] = [await placesIn(db, scope), await finalsIn(db, month, scope)];
  const openIds = places.filter((p) => !finals.has(p.id)).map((p) => p.id);
  const live = new Map((openIds.length === 0 ? [] : await liveCloses(db, month, finals.size === 0 ? scope : openIds)).map((l) => [l.locationId, l]));
  // Each shop's next month to close, worked out once.
  const nexts = new Map(places.filter((p) => p.lastFinal !== null).map((p) => [p.id, nextMonth(p.lastFinal!)]));
  const nextToClose = (id: number) => nexts.get(id) ?? null;
  const isNext = (id: number) => !nexts.has(id) || nexts.get(id) === month;
  const drifts = await driftsOf(db, openIds.filter((id) => nexts.has(id) && isNext(id)));
  // Each shop's record is completed where it stands (spreading hundreds of them into new ones took V8's slow path).
  const locations = places.map(({ id }): LocationClose => {
    const final = finals.get(id);
    if (final) return Object.assign(final, { nextToClose: nextToClose(id) });
    return Object.assign(live.get(id)!, {
      status: 'open' as const,
      finalizedAt: null,
      finalizedByName: null,
      next: isNext(id),
      nextToClose: nextToClose(id),
      adjustments: adjustmentsOf(drifts.filter((d) => d.locationId === id)),
    });
  });
  const total = Object.fromEntries(FIGURES.map((f) => [f, locations.reduce((sum, l) => sum + l[f], 0)])) as unknown as MonthCloseFigures;
  // A few zones cover the network: each is asked once.
  return { month, ended: [...new Set(places.map((p) => p.timeZone))].every((zone) => endedAt(zone, month, now)), locations, total };
}

/** The locations of `scope` in the order the close lists them, with their zones and their last month final (one seek each). */
function placesIn(db: Db, scope: LocationScope): Promise<{ id: number; timeZone: string; lastFinal: string | null }[]> {
  let query = db
    .selectFrom('locations as l')
    .select(['l.id', 'l.timeZone', LAST_FINAL.as('lastFinal')])
    .orderBy('l.code');
  if (scope !== 'all') query = query.where('l.id', 'in', scope.length > 0 ? scope : [0]);
  return query.execute();
}

/**
 * Marks a location's month final, as it stands with the adjustments it takes up: once the month
 * has ended there, in order (the month after the last final one; any month for the first). Its
 * figures are kept as closed, the final months whose changes it took up count as accounted for,
 * and the audit log has it, all in one transaction.
 */
export async function finalizeMonth(db: Db, location: { id: number; name: string; timeZone: string }, month: string, by: { id: number; at: Date }): Promise<LocationClose> {
  return db.transaction().execute(async (trx) => {
    const [live] = (await liveCloses(trx, month, [location.id])) as [LiveClose];
    if (!endedAt(location.timeZone, month, by.at)) throw invalidField('month', `${inWords(month)} has not ended at ${location.name} yet`);
    if ((await finalsIn(trx, month, [location.id])).size > 0) throw conflict(`${inWords(month)} is already final at ${location.name}`);
    const last = (await lastFinals(trx, [location.id])).get(location.id);
    if (last && nextMonth(last) !== month) {
      const next = nextMonth(last);
      throw invalidField('month', next > month ? `Months close in order: ${inWords(last)} is final at ${location.name}, so ${inWords(month)} stays open` : `Close ${inWords(next)} at ${location.name} first: months close in order`);
    }
    const drifts = await driftsOf(trx, last ? [location.id] : []);
    const closed = { ...live, adjustments: adjustmentsOf(drifts) };
    await trx
      .insertInto('monthCloses')
      .values({ locationId: location.id, month, finalizedAt: by.at.toISOString(), finalizedBy: by.id, figures: JSON.stringify(closed), carried: JSON.stringify(await carriedNow(trx, location.id, month)) })
      .execute();
    for (const d of drifts) {
      await trx.updateTable('monthCloses').set({ carried: JSON.stringify(d.live) }).where('locationId', '=', location.id).where('month', '=', d.month).execute();
    }
    // Every final month of the shop is now accounted for as it stands (those changed and put back included).
    await trx.updateTable('monthCloses').set({ changed: 0 }).where('locationId', '=', location.id).where('changed', '=', 1).execute();
    await writeAudit(trx, { at: by.at.toISOString(), actorId: by.id, action: 'close.final', entity: 'location', entityId: location.id, before: null, after: { month, ...closed } });
    return { ...(await finalsIn(trx, month, [location.id])).get(location.id)!, nextToClose: nextMonth(month) };
  });
}
