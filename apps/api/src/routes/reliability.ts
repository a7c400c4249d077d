import { DAY_MS, isoDay } from '@busbar/calc';
import { reliabilityDetailParams, reliabilityDetailQuery, reliabilityQuery } from '@busbar/shared';
import { Router } from 'express';
import { locationScope, type LocationScope } from '../access/locations.ts';
import type { Viewer } from '../access/viewer.ts';
import type { AppContext } from '../context.ts';
import { forbidden, notFound } from '../errors.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { background } from '../threads/background.ts';
import { sendEncodedJson } from '../web/compress.ts';
import { acceptedEncoding } from '../web/encoding.ts';

/**
 * Component reliability in the person's locations (a lead's shop, a regional manager's region, or
 * the network), each compared with the whole network without naming shops they may not see.
 */
export function reliabilityRouter({ config, now }: AppContext): Router {
  const router = Router();
  const clock = () => {
    const todayDay = Math.floor(now().getTime() / DAY_MS);
    return { today: isoDay(todayDay), todayDay };
  };

  router.get(
    '/',
    validate({ query: reliabilityQuery }, async ({ query }, req, res) => {
      const { today, todayDay } = clock();
      const selected = chosenLocations(visibleTo(viewerOf(req)), query.locationIds);
      sendEncodedJson(res, await background.run('reliabilityListOf', config.databaseFile, acceptedEncoding(req), selected, query, today, todayDay));
    }),
  );

  router.get(
    '/:groupBy/:key',
    validate({ params: reliabilityDetailParams, query: reliabilityDetailQuery }, async ({ params, query }, req, res) => {
      const visible = visibleTo(viewerOf(req));
      const selected = chosenLocations(visible, query.locationIds);
      const { today, todayDay } = clock();
      sendEncodedJson(res, await background.run('reliabilityDetailOf', config.databaseFile, acceptedEncoding(req), params, selected, visible, query, today, todayDay));
    }),
  );
  return router;
}

/** The locations whose reliability the person may read. */
const visibleTo = (viewer: Viewer): LocationScope => locationScope(viewer, 'read', 'Reliability');

/** The locations asked for, all of them the person's (`scope`; a location outside it answers 404), or all of theirs. */
function chosenLocations(scope: LocationScope, asked: number[] | undefined): LocationScope {
  if (scope !== 'all' && scope.length === 0) throw forbidden('Reliability figures are for location leads, regional managers and the owner');
  if (!asked || asked.length === 0) return scope;
  if (scope !== 'all' && asked.some((id) => !scope.includes(id))) throw notFound('location');
  return asked;
}
