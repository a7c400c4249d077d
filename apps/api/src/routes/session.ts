import type { Db } from '@busbar/db';
import { sessionSettingsBody, signInBody, type SessionView } from '@busbar/shared';
import { Router, type Request, type Response } from 'express';
import { loadViewer, type Viewer } from '../access/viewer.ts';
import { hashPassword, needsRehash, unmatchableHash, verifyPassword } from '../auth/password.ts';
import type { AppContext } from '../context.ts';
import { HttpError } from '../errors.ts';
import { auditSignInEvent, recordFailedSignIn } from '../auth/sign-in-events.ts';
import { signInLimiter } from '../middleware/rate-limit.ts';
import { requireSession, viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { findUserForSignIn, recordSignIn, setPasswordHash } from '../queries/users.ts';
import { passwordChangeRouter } from './password-change.ts';

export const SESSION_COOKIE = 'busbar.sid';

/** Why a sign-in cannot set its cookie, for the person and the log alike. */
const COOKIE_NOT_SENT =
  'PUBLIC_URL is https, so the session cookie is sent only over https, but this request reached Busbar as plain http. Behind an https proxy, set TRUST_PROXY=true (and have the proxy send X-Forwarded-Proto); otherwise make PUBLIC_URL the address people really use.';

/** Compared against when the e-mail is unknown, so both failures take the same time. */
/** Starts a fresh session (a new id, against session fixation) for a person and answers their view. */
export async function signIn({ db, now }: AppContext, req: Request, res: Response, userId: number): Promise<void> {
  // express-session silently sends no Secure cookie over a request it sees as plain http: the person would seem signed in, then not.
  if (req.session.cookie.secure && !req.secure) {
    console.error(`Sign-in refused: no session cookie can be sent. ${COOKIE_NOT_SENT}`);
    throw new HttpError(500, 'session_cookie_not_sent', `Busbar cannot sign anyone in as it is set up. ${COOKIE_NOT_SENT}`);
  }
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

  const limiter = signInLimiter(ctx.db, ctx.config.signInLimit, ctx.now);

  // Counted only once the body is valid: a malformed request is never a failed sign-in.
  router.post(
    '/',
    validate({ body: signInBody }, async ({ body }, req, res) => {
      await limiter.admit(body.email, req, res);
      const user = await findUserForSignIn(ctx.db, body.email);
      const matches = await verifyPassword(body.password, user?.passwordHash ?? unmatchableHash(ctx.config.scryptLogN));
      // One message for every failure, so the answer does not tell which e-mails have accounts.
      if (!user || !matches || user.status !== 'active') {
        await recordFailedSignIn(ctx.db, limiter, req, ctx.now(), { email: body.email, userId: user?.id ?? null });
        throw new HttpError(401, 'invalid_credentials', 'That e-mail and password do not match an active account');
      }
      if (needsRehash(user.passwordHash!, ctx.config.scryptLogN)) await setPasswordHash(ctx.db, user.id, await hashPassword(body.password, ctx.config.scryptLogN));
      await limiter.succeed(body.email, req);
      await auditSignInEvent(ctx.db, req, ctx.now(), { action: 'session.sign_in', actorId: user.id, userId: user.id });
      await signIn(ctx, req, res, user.id);
    }),
  );

  router.use(passwordChangeRouter(ctx, limiter));

  router.delete('/', async (req, res) => {
    const userId = req.session.userId;
    if (userId) await auditSignInEvent(ctx.db, req, ctx.now(), { action: 'session.sign_out', actorId: userId, userId });
    await new Promise<void>((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())));
    res.clearCookie(SESSION_COOKIE, { path: '/' });
    res.status(204).end();
  });

  return router;
}
