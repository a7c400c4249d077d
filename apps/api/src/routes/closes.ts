import { subject } from '@casl/ability';
import { closeParams, closeQuery, closeStatusQuery } from '@busbar/shared';
import { Router } from 'express';
import { locationScope, reportWithin } from '../access/locations.ts';
import type { AppContext } from '../context.ts';
import { forbidden, notFound } from '../errors.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { closeStatus } from '../queries/close-status.ts';
import { finalizeMonth, monthClose } from '../queries/month-close.ts';

const CLOSERS_ONLY = 'Only the accountant and the network owner close months';
const REFUSALS = { none: CLOSERS_ONLY, outside: 'You cannot close the months of that shop or region' };

/**
 * The month close of the person's locations (the accountant's and the owner's: people who export
 * reports, and who read every money figure), within the shop or region asked for; and marking a
 * location's month final; and where each location stands with a range of months.
 */
export function closesRouter({ db, now }: AppContext): Router {
  const router = Router();

  router.get(
    '/',
    validate({ query: closeQuery }, async ({ query }, req, res) => {
      const viewer = viewerOf(req);
      const scope = reportWithin(viewer, locationScope(viewer, 'export', 'Report'), query, REFUSALS);
      res.json(await monthClose(db, query.month, scope, now()));
    }),
  );

  router.get(
    '/status',
    validate({ query: closeStatusQuery }, async ({ query }, req, res) => {
      const viewer = viewerOf(req);
      const scope = reportWithin(viewer, locationScope(viewer, 'export', 'Report'), query, REFUSALS);
      res.json(await closeStatus(db, query.from, query.to, scope, now()));
    }),
  );

  router.post(
    '/:locationId/:month/final',
    validate({ params: closeParams }, async ({ params }, req, res) => {
      const viewer = viewerOf(req);
      const location = await db.selectFrom('locations').select(['id', 'name', 'timeZone']).where('id', '=', params.locationId).executeTakeFirst();
      if (!location || !viewer.ability.can('read', subject('Location', { id: location.id }))) throw notFound('location');
      if (!viewer.ability.can('export', subject('Report', { locationId: location.id }))) throw forbidden(CLOSERS_ONLY);
      res.status(201).json(await finalizeMonth(db, location, params.month, { id: viewer.id, at: now() }));
    }),
  );

  return router;
}
