import type { Db } from '@busbar/db';
import type { Request } from 'express';
import type { SignInLimiter } from '../middleware/rate-limit.ts';
import { writeAudit } from '../queries/audit.ts';

/** Where a request came from, as the audit log keeps it beside sign-in events. */
export const originOf = (req: Request) => ({ address: req.ip ?? null, userAgent: req.get('user-agent')?.slice(0, 300) ?? null });

/** An audit row about a person's sign-in or password, by themselves (`actorId`) or by someone not signed in (null). */
export function auditSignInEvent(
  db: Db,
  req: Request,
  at: Date,
  entry: { action: string; actorId: number | null; userId: number | null; details?: Record<string, unknown> },
): Promise<void> {
  return writeAudit(db, {
    at: at.toISOString(),
    actorId: entry.actorId,
    action: entry.action,
    entity: 'user',
    entityId: entry.userId,
    after: { ...entry.details, ...originOf(req) },
  });
}

/**
 * Counts a wrong password (at sign-in or when changing it) and audits it, and the lock-out it
 * caused if any. The typed e-mail is kept, so failures on unknown e-mails show up too. At sign-in
 * the one trying is not known, so no actor is named; a signed-in person changing their password is.
 */
export async function recordFailedSignIn(
  db: Db,
  limiter: SignInLimiter,
  req: Request,
  at: Date,
  who: { email: string; userId: number | null; during?: 'password_change' },
): Promise<void> {
  const locked = await limiter.fail(who.email, req);
  const details = { email: who.email, ...(who.during ? { during: who.during } : {}) };
  const actorId = who.during ? who.userId : null;
  await auditSignInEvent(db, req, at, { action: 'session.sign_in_failed', actorId, userId: who.userId, details });
  if (locked) await auditSignInEvent(db, req, at, { action: 'session.locked', actorId, userId: who.userId, details: { ...details, locked } });
}
