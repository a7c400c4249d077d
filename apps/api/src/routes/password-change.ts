import { changePasswordBody } from '@busbar/shared';
import { Router } from 'express';
import { checkNewPassword } from '../auth/password-rule.ts';
import { hashPassword, verifyPassword } from '../auth/password.ts';
import { auditSignInEvent, recordFailedSignIn } from '../auth/sign-in-events.ts';
import type { AppContext } from '../context.ts';
import { invalidField } from '../errors.ts';
import type { SignInLimiter } from '../middleware/rate-limit.ts';
import { requireSession, viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { endSessions, findPasswordHash } from '../queries/passwords.ts';
import { setPasswordHash } from '../queries/users.ts';

/**
 * `POST /api/session/password`: a person changes their own password. A wrong current password
 * counts as a failed sign-in (someone at an unlocked screen must not guess it freely); the
 * person's other sessions end, this one goes on.
 */
export function passwordChangeRouter({ db, config, now }: AppContext, limiter: SignInLimiter): Router {
  const router = Router();
  router.post(
    '/password',
    requireSession(db),
    validate({ body: changePasswordBody }, async ({ body }, req, res) => {
      const viewer = viewerOf(req);
      await limiter.admit(viewer.email, req, res);
      const { passwordHash } = await findPasswordHash(db, viewer.id);
      if (!passwordHash || !(await verifyPassword(body.currentPassword, passwordHash))) {
        await recordFailedSignIn(db, limiter, req, now(), { email: viewer.email, userId: viewer.id, during: 'password_change' });
        throw invalidField('currentPassword', 'That is not your current password');
      }
      if (body.newPassword === body.currentPassword) throw invalidField('newPassword', 'Choose a password other than your current one');
      await checkNewPassword(body.newPassword, viewer, 'newPassword');
      const newHash = await hashPassword(body.newPassword, config.scryptLogN);
      await db.transaction().execute(async (trx) => {
        await setPasswordHash(trx, viewer.id, newHash);
        const sessionsEnded = await endSessions(trx, viewer.id, req.sessionID);
        await auditSignInEvent(trx, req, now(), { action: 'person.password_change', actorId: viewer.id, userId: viewer.id, details: { sessionsEnded } });
      });
      res.status(204).end();
    }),
  );
  return router;
}
