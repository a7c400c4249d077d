import { importBuildsBody } from '@busbar/shared';
import { Router } from 'express';
import type { AppContext } from '../context.ts';
import { locationToAddAt } from '../access/locations.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { background } from '../threads/background.ts';

/**
 * CSV import of historical builds: a dry run shows every row; nothing is written unless all pass.
 * It runs on the background thread, so the rest of the network is answered meanwhile.
 */
export function importsRouter({ db, config, now }: AppContext): Router {
  const router = Router();
  router.post(
    '/builds',
    validate({ body: importBuildsBody }, async ({ body }, req, res) => {
      const viewer = viewerOf(req);
      const { id, code, timeZone, laborRateCents } = await locationToAddAt(db, viewer, body.locationId, 'Build', 'You cannot add builds at this location');
      const location = { id, code, timeZone, laborRateCents };
      res.json(await background.run('importBuilds', { databaseFile: config.databaseFile, location, csv: body.csv, dryRun: body.dryRun, actorId: viewer.id, at: now().toISOString() }));
    }),
  );
  return router;
}
