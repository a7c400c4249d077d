import { randomBytes } from 'node:crypto';
import { acceptPasswordResetBody, passwordResetRequestBody, resetTokenParams, type PasswordResetView } from '@busbar/shared';
import { Router, type Request } from 'express';
import { checkNewPassword } from '../auth/password-rule.ts';
import { hashPassword } from '../auth/password.ts';
import { auditSignInEvent } from '../auth/sign-in-events.ts';
import type { AppContext } from '../context.ts';
import { HttpError, notFound } from '../errors.ts';
import { addressKey, tooMany } from '../middleware/rate-limit.ts';
import { validate } from '../middleware/validate.ts';
import { closeResetsOf, endSessions, findActivePerson, findOpenReset, insertPasswordReset } from '../queries/passwords.ts';
import { clearAttempts, countAttempts, limitReachedAt, recordAttempt } from '../queries/sign-in-attempts.ts';
import { setPasswordHash } from '../queries/users.ts';
import { signIn } from './session.ts';

/** The one answer to every accepted request, whether or not the e-mail has an account. */
const REQUESTED = { message: 'If that e-mail address has a Busbar account, a link to choose a new password is on its way. It works for an hour.' };
const NOT_VALID = 'password reset: this link was already used or is not valid';

function resetText(name: string, link: string, minutes: number): string {
  return [
    `Hello ${name},`,
    '',
    'Someone asked for a new Busbar password for this e-mail address. Choose one with this link:',
    '',
    link,
    '',
    `The link works once and expires in ${minutes} minutes. If you did not ask, ignore this e-mail: your password stays as it is.`,
  ].join('\n');
}

/** Forgotten passwords: a link by e-mail, then a new password with it. Open without a session. */
export function passwordResetsRouter(ctx: AppContext): Router {
  const { db, config, mailer, now } = ctx;
  const limits = config.passwordReset;
  const router = Router();

  /**
   * Stores a fresh link and audits it, with where the request came from, then mails it (stored
   * first, so the link works the moment the mail arrives).
   */
  async function sendLink(user: { id: number; email: string; name: string }, req: Request): Promise<void> {
    const token = randomBytes(32).toString('base64url');
    const at = now();
    await db.transaction().execute(async (trx) => {
      await insertPasswordReset(trx, { userId: user.id, token, createdAt: at.toISOString(), expiresAt: new Date(at.getTime() + limits.ttlMs).toISOString() });
      await auditSignInEvent(trx, req, at, { action: 'person.password_reset_link', actorId: null, userId: user.id });
    });
    const link = `${config.publicUrl}/reset-password?token=${token}`;
    await mailer.send({ to: user.email, subject: 'Choose a new Busbar password', text: resetText(user.name, link, Math.round(limits.ttlMs / 60_000)), secret: token });
  }

  router.post(
    '/',
    validate({ body: passwordResetRequestBody }, async ({ body }, req, res) => {
      const at = now();
      const since = new Date(at.getTime() - limits.windowMs).toISOString();
      const address = addressKey(req);
      // Every request counts for its address, known e-mail or not, so a refusal tells nothing about accounts.
      const full = await limitReachedAt(db, 'reset', since, { address }, limits.perAddress);
      if (full) throw tooMany(res, Math.ceil((Date.parse(full) + limits.windowMs - at.getTime()) / 1000), 'requests for a new password');
      const earlier = await countAttempts(db, 'reset', since, { email: body.email });
      await recordAttempt(db, { kind: 'reset', email: body.email, address, at: at.toISOString() }, since);
      const person = earlier < limits.perAccount ? await findActivePerson(db, body.email) : undefined;
      res.status(202).json(REQUESTED);
      // Mailed after answering, so how long the answer takes does not tell whether an account exists either.
      if (person) sendLink(person, req).catch((error: unknown) => console.error('A password reset e-mail failed:', error));
    }),
  );

  /** An open link, or why it is not. */
  async function openReset(token: string) {
    const reset = await findOpenReset(db, token);
    if (!reset) throw notFound(NOT_VALID);
    if (reset.expiresAt <= now().toISOString()) throw new HttpError(410, 'reset_expired', 'This link has expired. Ask for a new one.');
    return reset;
  }

  router.get(
    '/:token',
    validate({ params: resetTokenParams }, async ({ params }, _req, res) => {
      const { email, name, expiresAt } = await openReset(params.token);
      res.json({ email, name, expiresAt } satisfies PasswordResetView);
    }),
  );

  router.post(
    '/accept',
    validate({ body: acceptPasswordResetBody }, async ({ body }, req, res) => {
      const reset = await openReset(body.token);
      await checkNewPassword(body.password, reset);
      const passwordHash = await hashPassword(body.password, config.scryptLogN);
      await db.transaction().execute(async (trx) => {
        const at = now();
        // Claimed inside the transaction: of two requests racing with one link, only one wins.
        if (!(await closeResetsOf(trx, reset.userId, at.toISOString(), reset.id))) throw notFound(NOT_VALID);
        await setPasswordHash(trx, reset.userId, passwordHash);
        const sessionsEnded = await endSessions(trx, reset.userId);
        await auditSignInEvent(trx, req, at, { action: 'person.password_reset', actorId: reset.userId, userId: reset.userId, details: { sessionsEnded } });
      });
      // Whoever holds the mailbox is the person: their own address's failed sign-ins are forgiven.
      await clearAttempts(db, 'sign_in', { email: reset.email, address: addressKey(req) });
      await signIn(ctx, req, res, reset.userId);
    }),
  );
  return router;
}
