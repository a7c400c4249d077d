import type { Db } from '@busbar/db';
import { claimRuleSubject, type ClaimDetail, type ClaimView } from '@busbar/shared';
import { notFound } from '../errors.ts';
import { claimEvents, findClaim, localToday, type ClaimRow } from '../queries/claims.ts';
import { claimEvidence } from '../queries/evidence.ts';
import type { Viewer } from './viewer.ts';

/** A claim the person may read, or 404 — also for a claim of a location they cannot see. */
export async function loadClaim(db: Db, viewer: Viewer, id: number): Promise<ClaimRow> {
  const row = await findClaim(db, id);
  if (!row || !viewer.ability.can('read', claimRuleSubject(row))) throw notFound('claim');
  return row;
}

/**
 * A claim as people see it: overdue when its next step is past due today at its location. The
 * location's limit and zone, which the row brings along for the server, are left undefined, which
 * JSON leaves out: a rest pattern leaving them out of the copy took 0.2–0.5 ms of a page of 50.
 */
export function claimView(row: ClaimRow, now: Date): ClaimView & Partial<Record<'approvalLimitCents' | 'timeZone', undefined>> {
  return { ...row, approvalLimitCents: undefined, timeZone: undefined, overdue: row.dueOn !== null && row.dueOn < localToday(row.timeZone, now) };
}

export async function claimDetail(db: Db, viewer: Viewer, id: number, now: Date): Promise<ClaimDetail> {
  const claim = await loadClaim(db, viewer, id);
  const [events, evidence] = await Promise.all([claimEvents(db, id), claimEvidence(db, id)]);
  return { ...claimView(claim, now), approvalLimitCents: claim.approvalLimitCents, events, evidence };
}
