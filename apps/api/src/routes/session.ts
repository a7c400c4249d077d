import type { Db } from '@busbar/db';
import { sessionSettingsBody, signInBody, type SessionView } from '@busbar/shared';
import { Router, type Request, type Response } from 'express';
import { loadViewer, type Viewer } from '../access/viewer.ts';
import { hashPassword, needsRehash, unmatchableHash, verifyPassword } from '../auth/password.ts';
import type { AppContext } from '../context.ts';
import { HttpError } from '../errors.ts';
import { signInLimits } from '../middleware/rate-limit.ts';
import { requireSession, viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { findUserForSignIn, recordSignIn, setPasswordHash } from '../queries/users.ts';

export const SESSION_COOKIE = 'busbar.sid';

/** Compared against when the e-mail is unknown, so both failures take the same time. */
/** Starts a fresh session (a new id, against session fixation) for a person and answers their view. */
export async function signIn({ db, now }: AppContext, req: Request, res: Response, userId: number): Promise<void> {
  await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
  req.session.userId = userId;
  await new Promise<void>((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
  await recordSignIn(db, userId, now().toISOString());
  const viewer = await loadViewer(db, userId);
  if (!viewer) throw new HttpError(401, 'unauthenticated', 'Please sign in');
  res.json(await sessionView(db, viewer, now()));
}

async function sessionView(db: Db, viewer: Viewer, now: Date): Promise<SessionView> {
  const { weeklyDigest } = await db.selectFrom('users').select('weeklyDigest').where('id', '=', viewer.id).executeTakeFirstOrThrow();
  return {
    person: { id: viewer.id, email: viewer.email, name: viewer.name, weeklyDigest: weeklyDigest === 1 },
    assignments: viewer.assignments,
    rules: viewer.rules,
    today: now.toISOString().slice(0, 10),
  };
}

/** Sign-in, the current session, sign-out. */
export function sessionRouter(ctx: AppContext): Router {
  const router = Router();

  router.get('/', requireSession(ctx.db), async (req, res) => {
    res.json(await sessionView(ctx.db, viewerOf(req), ctx.now()));
  });

  // The person's own settings: for now, whether they get the weekly e-mail.
  router.patch(
    '/',
    requireSession(ctx.db),
    validate({ body: sessionSettingsBody }, async ({ body }, req, res) => {
      const viewer = viewerOf(req);
      await ctx.db.updateTable('users').set({ weeklyDigest: body.weeklyDigest ? 1 : 0 }).where('id', '=', viewer.id).execute();
      res.json(await sessionView(ctx.db, viewer, ctx.now()));
    }),
  );

  router.post(
    '/',
    ...signInLimits(ctx.config.signInLimit),
    validate({ body: signInBody }, async ({ body }, req, res) => {
      const user = await findUserForSignIn(ctx.db, body.email);
      const matches = await verifyPassword(body.password, user?.passwordHash ?? unmatchableHash(ctx.config.scryptLogN));
      // One message for every failure, so the answer does not tell which e-mails have accounts.
      if (!user || !matches || user.status !== 'active') {
        throw new HttpError(401, 'invalid_credentials', 'That e-mail and password do not match an active account');
      }
      if (needsRehash(user.passwordHash!, ctx.config.scryptLogN)) await setPasswordHash(ctx.db, user.id, await hashPassword(body.password, ctx.config.scryptLogN));
      await signIn(ctx, req, res, user.id);
    }),
  );

  router.delete('/', (req, res, next) => {
    req.session.destroy((err) => {
      if (err) return next(err);
      res.clearCookie(SESSION_COOKIE, { path: '/' });
      res.status(204).end();
    });
  });

  return router;
}
