import { serialQuery } from '@busbar/shared';
import { Router } from 'express';
import { buildLocations } from '../access/builds.ts';
import type { AppContext } from '../context.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { findSerials } from '../queries/serials.ts';

/** "Find a serial number" across every location the person may see. */
export function serialsRouter({ db }: AppContext): Router {
  const router = Router();
  router.get(
    '/',
    validate({ query: serialQuery }, async ({ query }, req, res) => {
      res.json(await findSerials(db, await buildLocations(db, viewerOf(req)), query.q));
    }),
  );
  return router;
}
