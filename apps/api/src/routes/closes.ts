import { closeQuery } from '@busbar/shared';
import { Router } from 'express';
import { locationScope, narrowScope } from '../access/locations.ts';
import type { AppContext } from '../context.ts';
import { forbidden } from '../errors.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { monthClose } from '../queries/month-close.ts';

/**
 * The month close of the person's locations (the accountant's and the owner's: people who export
 * reports, and who read every money figure), within the shop or region asked for.
 */
export function closesRouter({ db, now }: AppContext): Router {
  const router = Router();

  router.get(
    '/',
    validate({ query: closeQuery }, async ({ query }, req, res) => {
      const viewer = viewerOf(req);
      const readable = locationScope(viewer, 'export', 'Report');
      if (readable !== 'all' && readable.length === 0) throw forbidden('Only the accountant and the network owner close months');
      const scope = narrowScope(viewer, readable, query);
      if (scope !== 'all' && scope.length === 0) throw forbidden('You cannot close the months of that shop or region');
      res.json(await monthClose(db, query.month, scope, now()));
    }),
  );

  return router;
}
