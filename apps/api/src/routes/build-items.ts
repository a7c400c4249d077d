import { subject } from '@casl/ability';
import { buildItemAdd, buildItemParams, buildItemRemove, buildItemUpdate, idParams, SERIAL_MAY_WAIT, versionQuery } from '@busbar/shared';
import { Router } from 'express';
import { authorizeBuildChange, buildDetail, loadBuild } from '../access/builds.ts';
import type { Viewer } from '../access/viewer.ts';
import type { AppContext } from '../context.ts';
import { conflict, invalidField, notFound } from '../errors.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { writeAudit } from '../queries/audit.ts';
import { addBuildEvent, changeBuild, recomputeTotals, serialHolder } from '../queries/build-changes.ts';
import type { BuildRow } from '../queries/builds.ts';
import type { Db } from '@busbar/db';

/**
 * A serialized component is one unit per line and needs its serial number once the build leaves the
 * bay; other components take none. A serial number is unique per SKU across the network.
 */
async function checkSerial(db: Db, viewer: Viewer, build: BuildRow, item: { sku: string; serialized: boolean }, quantity: number, serialNumber: string | null, itemId = 0) {
  if (!item.serialized) {
    if (serialNumber) throw invalidField('serialNumber', 'This component has no serial numbers');
    return;
  }
  if (quantity !== 1) throw invalidField('quantity', 'Serialized components are added one unit at a time');
  if (!serialNumber) {
    if (SERIAL_MAY_WAIT.includes(build.status)) return;
    throw invalidField('serialNumber', 'Enter the serial number of this unit');
  }
  const holder = await serialHolder(db, item.sku, serialNumber, itemId);
  if (holder) {
    const where = viewer.ability.can('read', subject('Build', { ...holder })) ? `build ${holder.number}` : 'another build';
    const message = `Serial number ${serialNumber} of ${item.sku} is already recorded on ${where}`;
    throw conflict(message, { serialNumber: message });
  }
}

/** The components installed in a build, each change versioned against the build. */
export function buildItemsRouter({ db, now }: AppContext): Router {
  const router = Router();

  /**
   * Runs a line change as one versioned build change, with its totals and audit. After delivery it is a
   * correction: the person's reason goes into the audit row (`after.reason`) and the build's history.
   */
  async function itemChange(viewer: Viewer, buildId: number, version: number, reason: string | null, audit: { action: string; before?: unknown; after?: object }, change: (trx: Db, at: string) => Promise<void>) {
    await db.transaction().execute(async (trx) => {
      const at = now().toISOString();
      await changeBuild(trx, buildId, version, at);
      await change(trx, at);
      await recomputeTotals(trx, buildId);
      if (reason) await addBuildEvent(trx, { buildId, at, actorId: viewer.id, kind: 'correction', note: reason });
      const after = reason ? { ...audit.after, reason } : audit.after;
      await writeAudit(trx, { at, actorId: viewer.id, action: audit.action, entity: 'build', entityId: buildId, before: audit.before, after });
    });
  }

  router.post(
    '/:id/items',
    validate({ params: idParams, body: buildItemAdd }, async ({ params, body }, req, res) => {
      const viewer = viewerOf(req);
      const build = await loadBuild(db, viewer, params.id);
      const reason = authorizeBuildChange(viewer, build, 'update', body.correctionNote) ? body.correctionNote! : null;
      const item = await db.selectFrom('catalogItems').selectAll().where('id', '=', body.catalogItemId).executeTakeFirst();
      if (!item) throw invalidField('catalogItemId', 'Choose a component from the catalog');
      if (!item.active) throw invalidField('catalogItemId', 'This component is no longer offered');
      await checkSerial(db, viewer, build, { sku: item.sku, serialized: !!item.serialized }, body.quantity, body.serialNumber);
      const line = { sku: item.sku, quantity: body.quantity, serialNumber: body.serialNumber, unitPriceCents: item.unitPriceCents, unitCostCents: item.unitCostCents };
      await itemChange(viewer, build.id, body.version, reason, { action: 'build.item.add', after: line }, async (trx, at) => {
        await trx.insertInto('buildItems').values({ ...line, buildId: build.id, catalogItemId: item.id, createdAt: at }).execute();
      });
      res.status(201).json(await buildDetail(db, viewer, build.id));
    }),
  );

  router.patch(
    '/:id/items/:itemId',
    validate({ params: buildItemParams, body: buildItemUpdate }, async ({ params, body }, req, res) => {
      const viewer = viewerOf(req);
      const build = await loadBuild(db, viewer, params.id);
      const reason = authorizeBuildChange(viewer, build, 'update', body.correctionNote) ? body.correctionNote! : null;
      const line = await db
        .selectFrom('buildItems as i')
        .innerJoin('catalogItems as c', 'c.id', 'i.catalogItemId')
        .select(['i.id', 'i.sku', 'i.quantity', 'i.serialNumber', 'c.serialized'])
        .where('i.id', '=', params.itemId)
        .where('i.buildId', '=', build.id)
        .executeTakeFirst();
      if (!line) throw notFound('component on this build');
      const quantity = body.quantity ?? line.quantity;
      const serialNumber = body.serialNumber === undefined ? line.serialNumber : body.serialNumber;
      await checkSerial(db, viewer, build, { sku: line.sku, serialized: !!line.serialized }, quantity, serialNumber, line.id);
      const before = { sku: line.sku, quantity: line.quantity, serialNumber: line.serialNumber };
      await itemChange(viewer, build.id, body.version, reason, { action: 'build.item.update', before, after: { sku: line.sku, quantity, serialNumber } }, async (trx) => {
        await trx.updateTable('buildItems').set({ quantity, serialNumber }).where('id', '=', line.id).execute();
      });
      res.json(await buildDetail(db, viewer, build.id));
    }),
  );

  router.delete(
    '/:id/items/:itemId',
    validate({ params: buildItemParams, query: versionQuery, body: buildItemRemove }, async ({ params, query, body }, req, res) => {
      const viewer = viewerOf(req);
      const build = await loadBuild(db, viewer, params.id);
      const reason = authorizeBuildChange(viewer, build, 'update', body.correctionNote) ? body.correctionNote! : null;
      const line = await db.selectFrom('buildItems').selectAll().where('id', '=', params.itemId).where('buildId', '=', build.id).executeTakeFirst();
      if (!line) throw notFound('component on this build');
      await itemChange(viewer, build.id, query.version, reason, { action: 'build.item.remove', before: line }, async (trx) => {
        await trx.deleteFrom('buildItems').where('id', '=', line.id).execute();
      });
      res.json(await buildDetail(db, viewer, build.id));
    }),
  );

  return router;
}
