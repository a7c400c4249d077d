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
import { buildHistoryRouter } from './routes/build-history.ts';
import { buildItemsRouter } from './routes/build-items.ts';
import { buildPlanRouter } from './routes/build-plan.ts';
import { buildsRouter } from './routes/builds.ts';
import { catalogRouter } from './routes/catalog.ts';
import { claimEvidenceRouter } from './routes/claim-evidence.ts';
import { claimReplacementRouter } from './routes/claim-replacement.ts';
import { claimSendRouter } from './routes/claim-send.ts';
import { claimsRouter } from './routes/claims.ts';
import { closesRouter } from './routes/closes.ts';
import { customersRouter } from './routes/customers.ts';
import { exportsRouter } from './routes/exports.ts';
import { healthRouter } from './routes/health.ts';
import { importsRouter } from './routes/imports.ts';
import { invitesRouter } from './routes/invites.ts';
import { passwordResetsRouter } from './routes/password-resets.ts';
import { planStockRouter } from './routes/plan-stock.ts';
import { plansRouter } from './routes/plans.ts';
import { reliabilityRouter } from './routes/reliability.ts';
import { rollupsRouter } from './routes/rollups.ts';
import { SESSION_COOKIE, sessionRouter } from './routes/session.ts';
import { serialsRouter } from './routes/serials.ts';
import { staffRouter } from './routes/staff.ts';
import { vehiclesRouter } from './routes/vehicles.ts';
import { vendorsRouter } from './routes/vendors.ts';
import { compressResponses } from './web/compress.ts';
import { serveWeb } from './web/serve-web.ts';

export type { AppContext } from './context.ts';

/** The whole HTTP application: the API under /api and, when built, the web app. */
export function createApp(ctx: AppContext): Express {
  const { db, config, now } = ctx;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy ? 1 : false);
  const secureCookies = config.publicUrl.startsWith('https://');

  app.use(helmet({ contentSecurityPolicy: { directives: { upgradeInsecureRequests: null } } }));
  app.use(compressResponses());
  // API answers hold people's records: no browser or proxy cache keeps them (a shared computer, a back button after sign-out).
  app.use('/api', (_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  // An import carries a whole CSV file; every other request stays small.
  app.use('/api/imports', express.json({ limit: '6mb' }));
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
  app.use('/api', csrfProtection(config.sessionSecret, secureCookies, config.publicOrigin));

  const invites = invitesRouter(ctx);
  app.use('/api/health', healthRouter(ctx));
  app.use('/api/session', sessionRouter(ctx));
  app.use('/api/invites', invites.public);
  app.use('/api/password-resets', passwordResetsRouter(ctx));
  app.use('/api/staff', requireSession(db), requireStaffAccess, invites.staff, staffRouter(ctx));
  app.use('/api/vendors', requireSession(db), vendorsRouter(ctx));
  app.use('/api/catalog', requireSession(db), catalogRouter(ctx));
  app.use('/api/customers', requireSession(db), customersRouter(ctx));
  app.use('/api/vehicles', requireSession(db), vehiclesRouter(ctx));
  app.use('/api/builds', requireSession(db), buildsRouter(ctx), buildItemsRouter(ctx), buildHistoryRouter(ctx), buildPlanRouter(ctx));
  app.use('/api/plans', requireSession(db), planStockRouter(ctx), plansRouter(ctx));
  app.use('/api/claims', requireSession(db), claimsRouter(ctx), claimEvidenceRouter(ctx), claimSendRouter(ctx), claimReplacementRouter(ctx));
  app.use('/api/serials', requireSession(db), serialsRouter(ctx));
  app.use('/api/reliability', requireSession(db), reliabilityRouter(ctx));
  app.use('/api/rollups', requireSession(db), rollupsRouter(ctx));
  app.use('/api/closes', requireSession(db), closesRouter(ctx));
  app.use('/api/exports', requireSession(db), exportsRouter(ctx));
  app.use('/api/imports', requireSession(db), importsRouter(ctx));
  app.use('/api', requireSession(db), adminRouter(ctx));
  app.use('/api', () => {
    throw notFound('API route');
  });

  if (config.webDist) serveWeb(app, config.webDist);

  app.use(errorHandler);
  return app;
}
