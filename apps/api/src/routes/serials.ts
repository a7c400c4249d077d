import { serialQuery } from '@busbar/shared';
import { Router } from 'express';
import { locationScope } from '../access/locations.ts';
import type { AppContext } from '../context.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { findSerials } from '../queries/serials.ts';

/** "Find a serial number" across every location the person may see, a page at a time. */
export function serialsRouter({ db }: AppContext): Router {
  const router = Router();
  router.get(
    '/',
    validate({ query: serialQuery }, async ({ query }, req, res) => {
      const viewer = viewerOf(req);
      res.json(await findSerials(db, locationScope(viewer, 'read', 'Build'), query));
    }),
  );
  return router;
}
