import { serialQuery } from '@busbar/shared';
import { Router } from 'express';
import { locationsWhere } from '../access/fields.ts';
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
      res.json(await findSerials(db, await locationsWhere(db, viewerOf(req).ability, 'read', 'Build'), query.q));
    }),
  );
  return router;
}
