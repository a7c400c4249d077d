import { subject } from '@casl/ability';
import { buildLeadQuery, idParams, locationListQuery, locationUpdate, noQuery, royaltyTermsBody, salesTaxBody, type AppAbility } from '@busbar/shared';
import { Router } from 'express';
import type { AppContext } from '../context.ts';
import { locationScope, reportWithin, seenLocations } from '../access/locations.ts';
import { conflict, forbidden, notFound } from '../errors.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { buildLeadsAt, pageBuildLeads } from '../queries/assignments.ts';
import { writeAudit } from '../queries/audit.ts';
import { findLocationSettings, listLocations, pageLocations, setApprovalLimit } from '../queries/locations.ts';
import { inWords } from '../queries/month-close.ts';
import { listRoyaltyTerms, setRoyaltyTerms } from '../queries/royalty-terms.ts';
import { addSalesTax, listSalesTax } from '../queries/sales-tax.ts';

const canRead = (ability: AppAbility, id: number) => ability.can('read', subject('Location', { id }));
/** Whoever reads the shop's reports with its revenue: the sales tax collected follows from both. */
const readsMoneyAt = (ability: AppAbility, locationId: number) =>
  ability.can('read', subject('Report', { locationId })) && ability.can('read', subject('Build', { locationId }), 'totalCents');

/**
 * Locations: every one a person may see, whole (for pickers and labels); a page of them with their
 * settings; a page of the people who lead builds at them; one location; the owner's change of its
 * claim approval limit; its royalty terms, which the owner sets and the accountant reads; and its
 * sales tax rates, which the owner sets and whoever reads the shop's revenue reads.
 */
export function locationsRouter({ db, now }: AppContext): Router {
  const router = Router();

  router.get(
    '/',
    validate({ query: noQuery }, async (_input, req, res) => {
      res.json(await listLocations(db, seenLocations(viewerOf(req))));
    }),
  );

  router.get(
    '/settings',
    validate({ query: locationListQuery }, async ({ query }, req, res) => {
      res.json(await pageLocations(db, seenLocations(viewerOf(req)), query));
    }),
  );

  router.get(
    '/technicians',
    validate({ query: buildLeadQuery }, async ({ query }, req, res) => {
      const viewer = viewerOf(req);
      const { locationId, regionId, ...filter } = query;
      const scope = reportWithin(viewer, locationScope(viewer, 'read', 'Build'), { locationId, regionId }, {
        none: 'You read the builds of no shop',
        outside: 'You cannot read the builds of that shop or region',
      });
      res.json(await pageBuildLeads(db, scope, filter));
    }),
  );

  router.get(
    '/:id',
    validate({ params: idParams }, async ({ params }, req, res) => {
      const location = await findLocationSettings(db, params.id);
      if (!location || !canRead(viewerOf(req).ability, location.id)) throw notFound('location');
      res.json(location);
    }),
  );

  router.patch(
    '/:id',
    validate({ params: idParams, body: locationUpdate }, async ({ params, body }, req, res) => {
      const viewer = viewerOf(req);
      const location = await findLocationSettings(db, params.id);
      if (!location || !canRead(viewer.ability, location.id)) throw notFound('location');
      if (!viewer.ability.can('update', subject('Location', { id: location.id }))) throw forbidden('Only the network owner sets a location’s approval limit');
      await db.transaction().execute(async (trx) => {
        await setApprovalLimit(trx, location.id, body.claimApprovalLimitCents);
        const before = { claimApprovalLimitCents: location.claimApprovalLimitCents };
        await writeAudit(trx, { at: now().toISOString(), actorId: viewer.id, action: 'location.update', entity: 'location', entityId: location.id, before, after: body });
      });
      res.json(await findLocationSettings(db, location.id));
    }),
  );

  router.get(
    '/:id/royalty-terms',
    validate({ params: idParams, query: noQuery }, async ({ params }, req, res) => {
      const { ability } = viewerOf(req);
      if (!canRead(ability, params.id)) throw notFound('location');
      if (!ability.can('export', subject('Report', { locationId: params.id })) && !ability.can('update', subject('Location', { id: params.id }))) {
        throw forbidden('Only the network owner and the accountant read royalty terms');
      }
      res.json(await listRoyaltyTerms(db, params.id));
    }),
  );

  router.post(
    '/:id/royalty-terms',
    validate({ params: idParams, body: royaltyTermsBody }, async ({ params, body }, req, res) => {
      const viewer = viewerOf(req);
      if (!canRead(viewer.ability, params.id)) throw notFound('location');
      if (!viewer.ability.can('update', subject('Location', { id: params.id }))) throw forbidden('Only the network owner sets royalty terms');
      const at = now().toISOString();
      await db.transaction().execute(async (trx) => {
        const before = await setRoyaltyTerms(trx, params.id, body, { id: viewer.id, at });
        await writeAudit(trx, { at, actorId: viewer.id, action: 'location.royalty_terms', entity: 'location', entityId: params.id, before, after: body });
      });
      res.status(201).json(await listRoyaltyTerms(db, params.id));
    }),
  );

  router.get(
    '/:id/sales-tax',
    validate({ params: idParams, query: noQuery }, async ({ params }, req, res) => {
      const { ability } = viewerOf(req);
      const location = await findLocationSettings(db, params.id);
      if (!location || !canRead(ability, location.id)) throw notFound('location');
      if (!readsMoneyAt(ability, location.id)) throw forbidden('Only people who read the shop’s revenue read its sales tax');
      res.json(await listSalesTax(db, location.id));
    }),
  );

  router.post(
    '/:id/sales-tax',
    validate({ params: idParams, body: salesTaxBody }, async ({ params, body }, req, res) => {
      const viewer = viewerOf(req);
      const location = await findLocationSettings(db, params.id);
      if (!location || !canRead(viewer.ability, location.id)) throw notFound('location');
      if (!viewer.ability.can('update', subject('Location', { id: location.id }))) throw forbidden('Only the network owner sets sales tax');
      const at = now().toISOString();
      await db.transaction().execute(async (trx) => {
        // A month's rate is never rewritten, so the audit log shows each as it was used; a change takes a later month.
        if (!(await addSalesTax(trx, location.id, body, { id: viewer.id, at }))) {
          const message = `${location.name} already has a sales tax rate from ${inWords(body.appliesFrom)}: set the new rate from a later month`;
          throw conflict(message, { appliesFrom: message });
        }
        await writeAudit(trx, { at, actorId: viewer.id, action: 'location.sales_tax', entity: 'location', entityId: location.id, before: null, after: body });
      });
      res.status(201).json(await listSalesTax(db, location.id));
    }),
  );

  router.get(
    '/:id/technicians',
    validate({ params: idParams }, async ({ params }, req, res) => {
      if (!canRead(viewerOf(req).ability, params.id)) throw notFound('location');
      res.json(await buildLeadsAt(db, params.id));
    }),
  );

  return router;
}
