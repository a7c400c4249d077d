import { importBuildsBody, type ImportResult } from '@busbar/shared';
import { Router } from 'express';
import type { AppContext } from '../context.ts';
import { locationToAddAt } from '../access/locations.ts';
import { checkImport } from '../imports/check-rows.ts';
import { writeImport } from '../imports/write-rows.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';

/** CSV import of historical builds: a dry run shows every row; nothing is written unless all pass. */
export function importsRouter({ db, now }: AppContext): Router {
  const router = Router();
  router.post(
    '/builds',
    validate({ body: importBuildsBody }, async ({ body }, req, res) => {
      const viewer = viewerOf(req);
      const location = await locationToAddAt(db, viewer, body.locationId, 'Build', 'You cannot add builds at this location');
      const { results, rows } = await checkImport(db, location.id, body.csv);
      const ok = results.length > 0 && rows.length === results.length && results.every((r) => Object.keys(r.errors).length === 0);
      let created = 0;
      if (ok && !body.dryRun) {
        created = await db.transaction().execute((trx) => writeImport(trx, location, rows, viewer.id, now().toISOString()));
      }
      const answer: ImportResult = { ok, created, rows: results };
      res.json(answer);
    }),
  );
  return router;
}
