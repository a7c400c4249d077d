import { subject } from '@casl/ability';
import { importBuildsBody, type ImportResult } from '@busbar/shared';
import { Router } from 'express';
import type { AppContext } from '../context.ts';
import { forbidden, notFound } from '../errors.ts';
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
      const location = await db.selectFrom('locations').select(['id', 'code', 'timeZone', 'laborRateCents']).where('id', '=', body.locationId).executeTakeFirst();
      if (!location || !viewer.ability.can('read', subject('Location', { ...location }))) throw notFound('location');
      if (!viewer.ability.can('create', subject('Build', { locationId: location.id }))) throw forbidden('You cannot add builds at this location');
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
