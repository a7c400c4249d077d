import { subject } from '@casl/ability';
import { BUILD_STATUS_LABELS, buildCreate, buildQuery, buildStatusChange, buildUpdate, findTransition, idParams } from '@busbar/shared';
import { Router } from 'express';
import { authorizeBuildChange, buildDetail, buildView, loadBuild } from '../access/builds.ts';
import { checkBuildReferences } from '../access/build-references.ts';
import { locationScope, locationToAddAt, narrowScope } from '../access/locations.ts';
import type { AppContext } from '../context.ts';
import { forbidden, invalidField } from '../errors.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { writeAudit } from '../queries/audit.ts';
import { addBuildEvent, changeBuild, recomputeTotals } from '../queries/build-changes.ts';
import { buildItems, listBuilds, nextBuildNumber } from '../queries/builds.ts';
import { localDayAt } from '../queries/rollups-local-day.ts';

/** Builds of the locations a person may see: list, detail, booking, edits and the status workflow. */
export function buildsRouter({ db, now }: AppContext): Router {
  const router = Router();

  router.get(
    '/',
    validate({ query: buildQuery }, async ({ query }, req, res) => {
      const viewer = viewerOf(req);
      const scope = narrowScope(viewer, locationScope(viewer, 'read', 'Build'), query);
      // A ranking by price would tell what the price hides: refused unless every listed shop shows prices to the person.
      if (query.sort === 'totalCents') {
        const priced = locationScope(viewer, 'read', 'Build', 'totalCents');
        if (priced !== 'all' && (scope === 'all' ? viewer.locationIds : scope).some((id) => !priced.includes(id))) {
          throw invalidField('sort', 'Prices are not shown to your role, so builds cannot be sorted by them');
        }
      }
      const page = await listBuilds(db, scope, query);
      res.json({ ...page, items: page.items.map((row) => buildView(viewer, row)) });
    }),
  );

  router.get(
    '/:id',
    validate({ params: idParams }, async ({ params }, req, res) => {
      res.json(await buildDetail(db, viewerOf(req), params.id));
    }),
  );

  router.post(
    '/',
    validate({ body: buildCreate }, async ({ body }, req, res) => {
      const viewer = viewerOf(req);
      const location = await locationToAddAt(db, viewer, body.locationId, 'Build', 'You cannot book builds at this location');
      await checkBuildReferences(db, location.id, body);
      const id = await db.transaction().execute(async (trx) => {
        const at = now().toISOString();
        const { sequence, number } = await nextBuildNumber(trx, location);
        const row = await trx
          .insertInto('builds')
          .values({
            ...body,
            sequence,
            number,
            status: 'draft',
            laborRateCents: location.laborRateCents,
            laborCents: 0,
            partsPriceCents: 0,
            partsCostCents: 0,
            totalCents: 0,
            startedAt: null,
            deliveredAt: null,
            createdAt: at,
            updatedAt: at,
            createdBy: viewer.id,
          })
          .returning('id')
          .executeTakeFirstOrThrow();
        await recomputeTotals(trx, row.id);
        await addBuildEvent(trx, { buildId: row.id, at, actorId: viewer.id, kind: 'status', toStatus: 'draft', note: '' });
        await writeAudit(trx, { at, actorId: viewer.id, action: 'build.create', entity: 'build', entityId: row.id, after: { number, ...body } });
        return row.id;
      });
      res.status(201).json(await buildDetail(db, viewer, id));
    }),
  );

  router.patch(
    '/:id',
    validate({ params: idParams, body: buildUpdate }, async ({ params, body }, req, res) => {
      const viewer = viewerOf(req);
      const row = await loadBuild(db, viewer, params.id);
      const { version, correctionNote, ...patch } = body;
      const plans = ['customerId', 'vehicleId', 'leadTechnicianId', 'bookedFor'].some((k) => k in patch);
      const correction = authorizeBuildChange(viewer, row, plans ? 'plan' : 'update', correctionNote);
      await checkBuildReferences(db, row.locationId, patch, row);
      await db.transaction().execute(async (trx) => {
        const at = now().toISOString();
        await changeBuild(trx, row.id, version, at, patch);
        await recomputeTotals(trx, row.id);
        if (correction) await addBuildEvent(trx, { buildId: row.id, at, actorId: viewer.id, kind: 'correction', note: correctionNote! });
        const before = Object.fromEntries(Object.keys(patch).map((k) => [k, row[k as keyof typeof row]]));
        const after = correction ? { ...patch, reason: correctionNote } : patch;
        await writeAudit(trx, { at, actorId: viewer.id, action: correction ? 'build.correct' : 'build.update', entity: 'build', entityId: row.id, before, after });
      });
      res.json(await buildDetail(db, viewer, row.id));
    }),
  );

  router.post(
    '/:id/status',
    validate({ params: idParams, body: buildStatusChange }, async ({ params, body }, req, res) => {
      const viewer = viewerOf(req);
      const row = await loadBuild(db, viewer, params.id);
      const transition = findTransition(row.status, body.to);
      if (!transition) throw invalidField('to', `A build cannot go from ${BUILD_STATUS_LABELS[row.status]} to ${BUILD_STATUS_LABELS[body.to]}`);
      if (!viewer.ability.can(transition.action, subject('Build', { ...row }))) throw forbidden('You cannot make this change of status');
      if (body.to === 'booked' && !row.bookedFor) throw invalidField('to', 'Set the booked date before booking');
      if (body.to === 'in_bay' && !row.leadTechnicianId) throw invalidField('to', 'Choose a lead technician before the build goes in the bay');
      if (body.to === 'quality_check' || body.to === 'delivered') {
        const missing = (await buildItems(db, row.id)).filter((i) => i.serialized && !i.serialNumber).map((i) => i.sku);
        if (missing.length > 0) throw invalidField('to', `Record the serial numbers first: ${missing.join(', ')}`);
      }
      await db.transaction().execute(async (trx) => {
        const at = now().toISOString();
        await changeBuild(trx, row.id, body.version, at, {
          status: body.to,
          ...(body.to === 'in_bay' && !row.startedAt ? { startedAt: at } : {}),
          ...(body.to === 'delivered' ? { deliveredAt: at, deliveredOn: await localDayAt(trx, row.locationId, at) } : {}),
        });
        await addBuildEvent(trx, { buildId: row.id, at, actorId: viewer.id, kind: 'status', fromStatus: row.status, toStatus: body.to, note: body.note });
        await writeAudit(trx, { at, actorId: viewer.id, action: 'build.status', entity: 'build', entityId: row.id, before: { status: row.status }, after: { status: body.to, note: body.note } });
      });
      res.json(await buildDetail(db, viewer, row.id));
    }),
  );

  return router;
}
