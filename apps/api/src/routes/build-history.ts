import { idParams, noQuery } from '@busbar/shared';
import { Router } from 'express';
import { loadBuild } from '../access/builds.ts';
import { locationScope } from '../access/locations.ts';
import type { AppContext } from '../context.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { buildHistory } from '../queries/build-changes.ts';

/** A build's history in words, for whoever reads the build (another shop's build answers 404). */
export function buildHistoryRouter({ db }: AppContext): Router {
  const router = Router();
  router.get(
    '/:id/history',
    validate({ params: idParams, query: noQuery }, async ({ params }, req, res) => {
      const viewer = viewerOf(req);
      const build = await loadBuild(db, viewer, params.id);
      res.json(await buildHistory(db, locationScope(viewer, 'read', 'Build'), build));
    }),
  );
  return router;
}
