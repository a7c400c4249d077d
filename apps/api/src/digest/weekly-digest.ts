import { DAY_MS, isoDay } from '@busbar/calc';
import type { Db } from '@busbar/db';
import { periodEnd, periodKey, periodNumber, periodStart } from '@busbar/shared';
import { locationScope } from '../access/locations.ts';
import { loadViewer } from '../access/viewer.ts';
import type { Mailer } from '../mail/mailer.ts';
import { moneyScopes, rollupReport } from '../queries/rollups-report.ts';
import { digestText, placesOf } from './digest-text.ts';

/** Monday noon UTC: every shop's Sunday has ended (Hawaii's at 10:00 UTC), and it is morning in the shops. */
const SEND_FROM_MS = 12 * 3_600_000;
const ROLES = ['regional_manager', 'location_lead'] as const;

/** The week the e-mail covers: the last whole week once this week's Monday noon UTC has passed, else none. */
export function digestWeek(now: Date): { key: string; start: string; end: string } | null {
  const thisWeek = periodNumber('week', isoDay(Math.floor(now.getTime() / DAY_MS)));
  if (now.getTime() < Date.parse(`${periodStart('week', thisWeek)}T00:00:00Z`) + SEND_FROM_MS) return null;
  return { key: periodKey('week', thisWeek - 1), start: periodStart('week', thisWeek - 1), end: periodEnd('week', thisWeek - 1) };
}

/**
 * Sends last week's figures to every active regional manager and location lead who has not turned
 * the e-mail off and has not had this week's yet, through the app's mail path (logged in the
 * Outbox). A week is claimed before its message goes and released if sending fails, so each
 * person gets it once, and a failed one is tried again at the next look. Answers how many went.
 */
export async function sendWeeklyDigests(db: Db, mailer: Mailer, publicUrl: string, now: Date): Promise<number> {
  const week = digestWeek(now);
  if (!week) return 0;
  const people = await db
    .selectFrom('users as u')
    .innerJoin('roleAssignments as r', 'r.userId', 'u.id')
    .select(['u.id', 'u.email', 'u.name', 'r.role'])
    .where('u.status', '=', 'active')
    .where('u.weeklyDigest', '=', 1)
    .where('r.role', 'in', ROLES)
    .where((eb) => eb.not(eb.exists(eb.selectFrom('weeklyDigests as d').select('d.userId').whereRef('d.userId', '=', 'u.id').where('d.week', '=', week.key))))
    .orderBy('u.id')
    .execute();
  const [locations, regions] = await Promise.all([db.selectFrom('locations').select(['id', 'code', 'name']).execute(), db.selectFrom('regions').select(['id', 'name']).execute()]);
  let sent = 0;
  for (const person of new Map(people.map((p) => [p.id, p])).values()) {
    const viewer = await loadViewer(db, person.id);
    const scope = viewer && locationScope(viewer, 'read', 'Report');
    if (!viewer || !scope || (scope !== 'all' && scope.length === 0)) continue;
    const claimed = await db.insertInto('weeklyDigests').values({ userId: person.id, week: week.key, sentAt: now.toISOString() }).onConflict((oc) => oc.doNothing()).executeTakeFirst();
    if (Number(claimed.numInsertedOrUpdatedRows) === 0) continue;
    const report = await rollupReport(db, { from: week.start, to: week.end, grain: 'week' }, scope, moneyScopes(viewer));
    const inScope = locations.filter((l) => scope === 'all' || scope.includes(l.id));
    const names = new Map(inScope.map((l) => [l.id, `${l.name} (${l.code})`]));
    const regional = people.some((p) => p.id === person.id && p.role === 'regional_manager');
    const mail = digestText({
      name: person.name,
      week,
      places: placesOf(report, names, new Map(regions.map((r) => [r.id, r.name]))),
      link: `${publicUrl}/${regional ? 'compare' : 'shop-week'}`,
      roleWords: regional ? 'a regional manager' : 'a location lead',
    });
    try {
      await mailer.send({ to: person.email, ...mail });
      sent++;
    } catch {
      await db.deleteFrom('weeklyDigests').where('userId', '=', person.id).where('week', '=', week.key).execute();
    }
  }
  return sent;
}
