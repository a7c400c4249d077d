import { subject } from '@casl/ability';
import { auditQuery, idParams, noQuery, outboxQuery, type AppAbility, type Subject } from '@busbar/shared';
import { Router, type Request } from 'express';
import type { AppContext } from '../context.ts';
import { forbidden, notFound } from '../errors.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { buildLeadsAt } from '../queries/assignments.ts';
import { listAudit } from '../queries/audit.ts';
import { listLocations, listRegions } from '../queries/locations.ts';
import { listMail } from '../queries/mail.ts';

function authorize(req: Request, action: 'read', on: Subject): AppAbility {
  const { ability } = viewerOf(req);
  if (!ability.can(action, on)) throw forbidden();
  return ability;
}

/** Regions and locations the person may see; the audit log and the outbox for the owner. */
export function adminRouter({ db }: AppContext): Router {
  const router = Router();

  router.get(
    '/regions',
    validate({ query: noQuery }, async (_input, req, res) => {
      const { ability } = viewerOf(req);
      res.json((await listRegions(db)).filter((r) => ability.can('read', subject('Region', { ...r }))));
    }),
  );

  router.get(
    '/locations',
    validate({ query: noQuery }, async (_input, req, res) => {
      const { ability } = viewerOf(req);
      res.json((await listLocations(db)).filter((l) => ability.can('read', subject('Location', { ...l }))));
    }),
  );

  router.get(
    '/locations/:id/technicians',
    validate({ params: idParams }, async ({ params }, req, res) => {
      const { ability } = viewerOf(req);
      if (!ability.can('read', subject('Location', { id: params.id }))) throw notFound('location');
      res.json(await buildLeadsAt(db, params.id));
    }),
  );

  router.get(
    '/audit',
    validate({ query: auditQuery }, async ({ query }, req, res) => {
      authorize(req, 'read', 'AuditLog');
      res.json(await listAudit(db, query));
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
