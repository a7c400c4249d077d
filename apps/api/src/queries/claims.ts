import { isoDay, localDay } from '@busbar/calc';
import type { Db } from '@busbar/db';
import { CLAIM_DUE_DAYS, type ClaimEventView, type ClaimStatus, type ClaimView } from '@busbar/shared';
import { sql } from 'kysely';
import { stale } from '../errors.ts';

/** A claim as stored, with what it names, plus its location's approval limit (for the rules) and zone (for its days). */
export type ClaimRow = Omit<ClaimView, 'overdue'> & { approvalLimitCents: number; timeZone: string };

/** Today in a zone at an instant, kept for the few zones of a page of claims (the zone database is slow to ask once a row). */
const todays = new Map<string, string>();

/** Today at a location, YYYY-MM-DD. */
export function localToday(timeZone: string, now: Date): string {
  const key = `${timeZone} ${now.getTime()}`;
  let today = todays.get(key);
  if (today === undefined) {
    if (todays.size >= 64) todays.clear();
    today = isoDay(localDay(timeZone, now.getTime()));
    todays.set(key, today);
  }
  return today;
}

/** The day the step after `status` is due, counted from today at the location; null once closed. */
export function dueOnFor(status: ClaimStatus, timeZone: string, now: Date): string | null {
  const days = CLAIM_DUE_DAYS[status];
  return days === null ? null : isoDay(localDay(timeZone, now.getTime()) + days);
}

/** Claims with what they name: build, unit, vendor, the replacement's serial number, the location's limit and zone. */
export function claimsWithNames(db: Db) {
  return db
    .selectFrom('warrantyClaims as w')
    .innerJoin('builds as b', 'b.id', 'w.buildId')
    .innerJoin('buildItems as i', 'i.id', 'w.buildItemId')
    .innerJoin('catalogItems as ci', 'ci.id', 'i.catalogItemId')
    .innerJoin('vendors as v', 'v.id', 'ci.vendorId')
    .innerJoin('locations as l', 'l.id', 'w.locationId')
    .leftJoin('buildItems as r', 'r.id', 'w.replacementItemId')
    .select([
      'w.id', 'w.number', 'w.locationId', 'w.buildId', 'b.number as buildNumber', 'w.buildItemId', 'i.sku', 'ci.name as itemName',
      'i.serialNumber', 'ci.vendorId', 'v.name as vendorName', sql<string | null>`coalesce(b.delivered_on, date(b.delivered_at))`.as('installedOn'), 'w.failedOn', 'w.failureMode',
      'w.coverage', 'w.symptoms', 'w.foundHow', 'w.laborHours', 'w.outOfWarranty', 'w.status', 'w.dueOn', 'w.vendorRmaNumber',
      'w.creditRequestedCents', 'w.creditApprovedCents', 'w.creditReceivedCents', 'w.replacementItemId', 'r.serialNumber as replacementSerialNumber',
      'w.createdAt', 'w.updatedAt', 'w.version',
      'l.claimApprovalLimitCents as approvalLimitCents', 'l.timeZone',
    ]);
}

type Raw = Awaited<ReturnType<ReturnType<typeof claimsWithNames>['executeTakeFirstOrThrow']>>;
// The unit went in on its build's delivery day, kept in the location's own zone (migration 021).
export const toRow = (raw: Raw): ClaimRow => ({ ...raw, outOfWarranty: raw.outOfWarranty === 1 });

export async function findClaim(db: Db, id: number): Promise<ClaimRow | undefined> {
  const raw = await claimsWithNames(db).where('w.id', '=', id).executeTakeFirst();
  return raw && toRow(raw);
}

export function claimEvents(db: Db, claimId: number): Promise<ClaimEventView[]> {
  return db
    .selectFrom('claimEvents as e')
    .leftJoin('users as u', 'u.id', 'e.actorId')
    .select(['e.at', 'u.name as actorName', 'e.fromStatus', 'e.toStatus', 'e.note'])
    .where('e.claimId', '=', claimId)
    .orderBy('e.id')
    .execute();
}

export async function addClaimEvent(db: Db, event: { claimId: number; at: string; actorId: number; fromStatus: ClaimStatus | null; toStatus: ClaimStatus; note: string }) {
  await db.insertInto('claimEvents').values(event).execute();
}

/** The next number of a location's claims: its code, W and a five-digit sequence. */
export async function nextClaimNumber(db: Db, location: { id: number; code: string }): Promise<{ sequence: number; number: string }> {
  const row = await db.selectFrom('warrantyClaims').select((eb) => eb.fn.max('sequence').as('last')).where('locationId', '=', location.id).executeTakeFirst();
  const sequence = Number(row?.last ?? 0) + 1;
  return { sequence, number: `${location.code}-W${String(sequence).padStart(5, '0')}` };
}

type ClaimChange = Partial<{
  [K in 'dueOn' | 'failedOn' | 'failureMode' | 'coverage' | 'symptoms' | 'foundHow' | 'laborHours' | 'creditRequestedCents' | 'vendorRmaNumber' | 'status' | 'creditApprovedCents' | 'creditReceivedCents' | 'replacementItemId']: ClaimRow[K];
}>;

/** Applies a change made against `version`; a claim changed since answers 409 stale. */
export async function changeClaim(db: Db, id: number, version: number, at: string, change: ClaimChange): Promise<void> {
  const result = await db
    .updateTable('warrantyClaims')
    .set((eb) => ({ ...change, updatedAt: at, version: eb('version', '+', 1) }))
    .where('id', '=', id)
    .where('version', '=', version)
    .executeTakeFirst();
  if (Number(result.numUpdatedRows) === 0) throw stale();
}
