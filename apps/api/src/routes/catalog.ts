import { subject } from '@casl/ability';
import { catalogItemBody, catalogItemUpdate, catalogQuery, idParams, type AppAbility, type CatalogItemBody } from '@busbar/shared';
import type { Db } from '@busbar/db';
import { Router } from 'express';
import { readable } from '../access/fields.ts';
import type { AppContext } from '../context.ts';
import { conflict, forbidden, HttpError, notFound, stale } from '../errors.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { writeAudit } from '../queries/audit.ts';
import { findCatalogItem, insertCatalogItem, listCatalog, skuTaken, updateCatalogItem } from '../queries/catalog.ts';
import { findVendor } from '../queries/vendors.ts';

const invalid = (fields: Record<string, string>) => new HttpError(400, 'invalid', 'Some fields need attention', fields);

/**
 * The vendor must exist, and a new item or a move to another vendor needs an active one; an item
 * whose vendor was retired later can still be edited.
 */
async function checkWrite(db: Db, body: CatalogItemBody, current?: { id: number; vendorId: number }) {
  const vendor = await findVendor(db, body.vendorId);
  if (!vendor) throw invalid({ vendorId: 'No such vendor' });
  if (!vendor.active && body.vendorId !== current?.vendorId) throw invalid({ vendorId: 'This vendor is no longer active' });
  if (await skuTaken(db, body.sku, current?.id)) throw conflict('Another catalog item already has this SKU', { sku: 'Already in use' });
}

function requireRead(ability: AppAbility) {
  if (!ability.can('read', 'CatalogItem')) throw forbidden();
}

/** The component catalog: read by every role without the money they may not see; kept by the owner. */
export function catalogRouter({ db, now }: AppContext): Router {
  const router = Router();

  router.get(
    '/',
    validate({ query: catalogQuery }, async ({ query }, req, res) => {
      const { ability } = viewerOf(req);
      requireRead(ability);
      const page = await listCatalog(db, query);
      res.json({ ...page, items: page.items.map((item) => readable(ability, 'CatalogItem', item)) });
    }),
  );

  router.get(
    '/:id',
    validate({ params: idParams }, async ({ params }, req, res) => {
      const { ability } = viewerOf(req);
      const item = await findCatalogItem(db, params.id);
      if (!item || !ability.can('read', subject('CatalogItem', { ...item }))) throw notFound('catalog item');
      res.json(readable(ability, 'CatalogItem', item));
    }),
  );

  router.post(
    '/',
    validate({ body: catalogItemBody }, async ({ body }, req, res) => {
      const viewer = viewerOf(req);
      if (!viewer.ability.can('create', 'CatalogItem')) throw forbidden('Only the network owner adds catalog items');
      const item = await db.transaction().execute(async (trx) => {
        await checkWrite(trx, body);
        const after = (await findCatalogItem(trx, await insertCatalogItem(trx, body)))!;
        await writeAudit(trx, { at: now().toISOString(), actorId: viewer.id, action: 'catalog_item.create', entity: 'catalog_item', entityId: after.id, after });
        return after;
      });
      res.status(201).json(readable(viewer.ability, 'CatalogItem', item));
    }),
  );

  router.put(
    '/:id',
    validate({ params: idParams, body: catalogItemUpdate }, async ({ params, body: { version, ...values } }, req, res) => {
      const viewer = viewerOf(req);
      const item = await db.transaction().execute(async (trx) => {
        const before = await findCatalogItem(trx, params.id);
        if (!before || !viewer.ability.can('read', subject('CatalogItem', { ...before }))) throw notFound('catalog item');
        if (!viewer.ability.can('update', subject('CatalogItem', { ...before }))) throw forbidden('Only the network owner changes catalog items');
        await checkWrite(trx, values, before);
        if (!(await updateCatalogItem(trx, before.id, version, values))) throw stale();
        const after = (await findCatalogItem(trx, before.id))!;
        await writeAudit(trx, { at: now().toISOString(), actorId: viewer.id, action: 'catalog_item.update', entity: 'catalog_item', entityId: before.id, before, after });
        return after;
      });
      res.json(readable(viewer.ability, 'CatalogItem', item));
    }),
  );

  return router;
}
