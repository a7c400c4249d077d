import { subject } from '@casl/ability';
import { idParams, vendorBody, vendorQuery, vendorUpdate } from '@busbar/shared';
import { Router } from 'express';
import { readable } from '../access/fields.ts';
import type { AppContext } from '../context.ts';
import { conflict, forbidden, notFound, stale } from '../errors.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { writeAudit } from '../queries/audit.ts';
import { findVendor, insertVendor, listVendors, updateVendor, vendorNameTaken } from '../queries/vendors.ts';

const nameTaken = () => conflict('Another vendor already has this name', { name: 'Already in use' });

/** The vendors components are bought from: read by every role, kept by the owner. */
export function vendorsRouter({ db, now }: AppContext): Router {
  const router = Router();

  router.get(
    '/',
    validate({ query: vendorQuery }, async ({ query }, req, res) => {
      const { ability } = viewerOf(req);
      if (!ability.can('read', 'Vendor')) throw forbidden();
      const page = await listVendors(db, query);
      res.json({ ...page, items: page.items.map((v) => readable(ability, 'Vendor', v)) });
    }),
  );

  router.post(
    '/',
    validate({ body: vendorBody }, async ({ body }, req, res) => {
      const viewer = viewerOf(req);
      if (!viewer.ability.can('create', 'Vendor')) throw forbidden('Only the network owner adds vendors');
      const vendor = await db.transaction().execute(async (trx) => {
        if (await vendorNameTaken(trx, body.name)) throw nameTaken();
        const after = (await findVendor(trx, await insertVendor(trx, body)))!;
        await writeAudit(trx, { at: now().toISOString(), actorId: viewer.id, action: 'vendor.create', entity: 'vendor', entityId: after.id, after });
        return after;
      });
      res.status(201).json(readable(viewer.ability, 'Vendor', vendor));
    }),
  );

  router.put(
    '/:id',
    validate({ params: idParams, body: vendorUpdate }, async ({ params, body: { version, ...values } }, req, res) => {
      const viewer = viewerOf(req);
      const vendor = await db.transaction().execute(async (trx) => {
        const before = await findVendor(trx, params.id);
        if (!before || !viewer.ability.can('read', subject('Vendor', { ...before }))) throw notFound('vendor');
        if (!viewer.ability.can('update', subject('Vendor', { ...before }))) throw forbidden('Only the network owner changes vendors');
        if (await vendorNameTaken(trx, values.name, before.id)) throw nameTaken();
        if (!(await updateVendor(trx, before.id, version, values))) throw stale();
        const after = (await findVendor(trx, before.id))!;
        await writeAudit(trx, { at: now().toISOString(), actorId: viewer.id, action: 'vendor.update', entity: 'vendor', entityId: before.id, before, after });
        return after;
      });
      res.json(readable(viewer.ability, 'Vendor', vendor));
    }),
  );

  return router;
}
