import { comparisonQuery, rollupPageQuery } from '@busbar/shared';
import { Router } from 'express';
import { locationScope, reportWithin } from '../access/locations.ts';
import type { Viewer } from '../access/viewer.ts';
import type { AppContext } from '../context.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { compareLocations } from '../queries/rollups-compare.ts';
import { moneyScopes } from '../queries/rollups-report.ts';
import { background } from '../threads/background.ts';
import { sendEncodedJson } from '../web/compress.ts';
import { acceptedEncoding } from '../web/encoding.ts';

/**
 * Roll-ups of the person's locations by day, week, month, quarter or year, each period beside the
 * one before and the same one a year before, with the whole network's totals; the rows of each
 * shop come a page of shops at a time. A lead receives their shop and the network, no other shop;
 * people who read no reports (technicians, warranty clerks) 403. Summed on the background thread.
 */
export function rollupsRouter({ db, config }: AppContext): Router {
  const router = Router();

  router.get(
    '/',
    validate({ query: rollupPageQuery }, async ({ query: { page, pageSize, ...query } }, req, res) => {
      const viewer = viewerOf(req);
      const scope = reportScope(viewer, query);
      sendEncodedJson(res, await background.run('rollupReportOf', config.databaseFile, acceptedEncoding(req), query, scope, moneyScopes(viewer), { page, pageSize }));
    }),
  );

  router.get(
    '/locations',
    validate({ query: comparisonQuery }, async ({ query }, req, res) => {
      const viewer = viewerOf(req);
      res.json(await compareLocations(db, query, reportScope(viewer, query), moneyScopes(viewer)));
    }),
  );

  return router;
}

/** The locations whose figures the person reads, within the shop or region asked for; none is refused. */
const reportScope = (viewer: Viewer, within: { locationId?: number | undefined; regionId?: number | undefined }) =>
  reportWithin(viewer, locationScope(viewer, 'read', 'Report'), within, {
    none: 'You cannot read the figures of any location',
    outside: 'You cannot read the figures of that shop or region',
  });
