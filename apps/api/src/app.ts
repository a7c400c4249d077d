import { join } from 'node:path';
import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import { requireStaffAccess } from './access/staff.ts';
import { DbSessionStore } from './auth/session-store.ts';
import type { AppContext } from './context.ts';
import { errorHandler, notFound } from './errors.ts';
import { csrfProtection } from './middleware/csrf.ts';
import { requireSession } from './middleware/session.ts';
import { adminRouter } from './routes/admin.ts';
import { healthRouter } from './routes/health.ts';
import { invitesRouter } from './routes/invites.ts';
import { SESSION_COOKIE, sessionRouter } from './routes/session.ts';
import { staffRouter } from './routes/staff.ts';

export type { AppContext } from './context.ts';

/** The whole HTTP application: the API under /api and, when built, the web app. */
export function createApp(ctx: AppContext): Express {
  const { db, config, now } = ctx;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy ? 1 : false);
  const secureCookies = config.publicUrl.startsWith('https://');

  app.use(helmet({ contentSecurityPolicy: { directives: { upgradeInsecureRequests: null } } }));
  app.use('/api', express.json({ limit: '100kb' }));
  app.use(
    '/api',
    session({
      name: SESSION_COOKIE,
      secret: config.sessionSecret,
      store: new DbSessionStore(db, now),
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: secureCookies, maxAge: 12 * 3_600_000, path: '/' },
    }),
  );
  app.use('/api', csrfProtection(config.sessionSecret, secureCookies));

  const invites = invitesRouter(ctx);
  app.use('/api/health', healthRouter(ctx));
  app.use('/api/session', sessionRouter(ctx));
  app.use('/api/invites', invites.public);
  app.use('/api/staff', requireSession(db), requireStaffAccess, invites.staff, staffRouter(ctx));
  app.use('/api', requireSession(db), adminRouter(ctx));
  app.use('/api', () => {
    throw notFound('API route');
  });

  if (config.webDist) {
    const dist = config.webDist;
    app.use(express.static(dist, { index: false, maxAge: '1h' }));
    app.get(/.*/, (_req, res) => res.sendFile(join(dist, 'index.html')));
  }

  app.use(errorHandler);
  return app;
}
