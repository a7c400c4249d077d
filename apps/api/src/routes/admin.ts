import { subject } from '@casl/ability';
import { auditQuery, noQuery, outboxQuery, type AppAbility, type Subject } from '@busbar/shared';
import { Router, type Request } from 'express';
import type { AppContext } from '../context.ts';
import { locationScope } from '../access/locations.ts';
import { forbidden } from '../errors.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { listAudit } from '../queries/audit.ts';
import { listRegions } from '../queries/locations.ts';
import { listMail } from '../queries/mail.ts';
import { locationsRouter } from './locations.ts';

function authorize(req: Request, action: 'read', on: Subject): AppAbility {
  const { ability } = viewerOf(req);
  if (!ability.can(action, on)) throw forbidden();
  return ability;
}

/** Regions and locations the person may see; the audit log and the outbox for the owner. */
export function adminRouter(ctx: AppContext): Router {
  const { db } = ctx;
  const router = Router();

  router.get(
    '/regions',
    validate({ query: noQuery }, async (_input, req, res) => {
      const { ability } = viewerOf(req);
      res.json((await listRegions(db)).filter((r) => ability.can('read', subject('Region', { ...r }))));
    }),
  );

  router.use('/locations', locationsRouter(ctx));

  router.get(
    '/audit',
    validate({ query: auditQuery }, async ({ query }, req, res) => {
      authorize(req, 'read', 'AuditLog');
      const viewer = viewerOf(req);
      const money = ['unitPriceCents', 'unitCostCents'].every((field) => locationScope(viewer, 'read', 'Build', field) === 'all');
      res.json(await listAudit(db, { scope: locationScope(viewer, 'read', 'Build'), money }, query));
    }),
  );

  router.get(
    '/outbox',
    validate({ query: outboxQuery }, async ({ query }, req, res) => {
      authorize(req, 'read', 'Mail');
      res.json(await listMail(db, query));
    }),
  );

  return router;
}
