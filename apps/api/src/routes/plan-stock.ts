import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../context.ts';
import { forbidden } from '../errors.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { planStock } from '../queries/plan-stock.ts';

/** The sizes the planner rounds its recommended bank and charger to, for the browser's live evaluation. */
export function planStockRouter({ db }: AppContext): Router {
  const router = Router();
  router.get(
    '/stock',
    validate({ query: z.strictObject({}) }, async (_input, req, res) => {
      if (!viewerOf(req).ability.can('read', 'Plan')) throw forbidden();
      res.json(await planStock(db));
    }),
  );
  return router;
}
