import { sql } from 'kysely';
import { Router } from 'express';
import type { HealthView } from '@busbar/shared';
import type { AppContext } from '../context.ts';
import { version } from '../version.ts';

/** Liveness for monitors: database reachable and the running version. */
export function healthRouter({ db }: AppContext): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    const database = await sql`select 1 as ok`.execute(db).then(
      () => 'ok' as const,
      () => 'unavailable' as const,
    );
    const body: HealthView = { status: database === 'ok' ? 'ok' : 'degraded', database, version };
    res.status(database === 'ok' ? 200 : 503).json(body);
  });
  return router;
}
