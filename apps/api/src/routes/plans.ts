import type { PlanInput } from '@busbar/calc';
import { idParams, planAttachBody, quickPlanCreate, quickPlanQuery, quickPlanUpdate } from '@busbar/shared';
import { Router } from 'express';
import { authorizeBuildChange } from '../access/builds.ts';
import { locationScope, locationToAddAt, narrowScope } from '../access/locations.ts';
import { canOnPlan, evaluateInput, loadPlan, planView, quickPlanSummaries } from '../access/plans.ts';
import type { AppContext } from '../context.ts';
import { conflict, forbidden, invalidField } from '../errors.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { writeAudit } from '../queries/audit.ts';
import { addBuildEvent } from '../queries/build-changes.ts';
import { findBuild } from '../queries/builds.ts';
import { keepPlanMargins } from '../queries/plan-margins.ts';
import { findBuildPlan, findPlan, insertPlan, listQuickPlans, revisePlan } from '../queries/plans.ts';

const attachedConflict = () => conflict('This plan belongs to a build now; change it on the build');

/** Quick plans from consultations, before there is a build, and attaching one to its build. */
export function plansRouter({ db, now }: AppContext): Router {
  const router = Router();

  router.get(
    '/',
    validate({ query: quickPlanQuery }, async ({ query }, req, res) => {
      const viewer = viewerOf(req);
      const scope = narrowScope(viewer, locationScope(viewer, 'read', 'Plan'), query);
      const { rows, ...page } = await listQuickPlans(db, scope, query);
      res.json({ ...page, items: await quickPlanSummaries(db, rows) });
    }),
  );

  router.get(
    '/:id',
    validate({ params: idParams }, async ({ params }, req, res) => {
      res.json(await planView(db, await loadPlan(db, viewerOf(req), params.id)));
    }),
  );

  router.post(
    '/',
    validate({ body: quickPlanCreate }, async ({ body }, req, res) => {
      const viewer = viewerOf(req);
      const location = await locationToAddAt(db, viewer, body.locationId, 'Plan', 'You cannot make plans at this location');
      const result = evaluateInput(body.input);
      const id = await db.transaction().execute(async (trx) => {
        const save = { at: now().toISOString(), actorId: viewer.id, input: body.input, note: '' };
        const planId = await insertPlan(trx, { buildId: null, locationId: location.id, name: body.name }, save);
        const after = { locationId: location.id, name: body.name, version: 1, verdict: result.verdict.kind };
        await writeAudit(trx, { at: save.at, actorId: viewer.id, action: 'plan.create', entity: 'plan', entityId: planId, after });
        return planId;
      });
      res.status(201).json(await planView(db, (await findPlan(db, id))!));
    }),
  );

  router.put(
    '/:id',
    validate({ params: idParams, body: quickPlanUpdate }, async ({ params, body }, req, res) => {
      const viewer = viewerOf(req);
      const plan = await loadPlan(db, viewer, params.id);
      if (!canOnPlan(viewer, 'update', plan)) throw forbidden('You cannot change plans at this location');
      if (plan.buildId !== null) throw attachedConflict();
      const result = evaluateInput(body.input);
      await db.transaction().execute(async (trx) => {
        const save = { at: now().toISOString(), actorId: viewer.id, input: body.input, note: '' };
        await revisePlan(trx, plan.id, body.version, save, { name: body.name });
        const before = { name: plan.name, version: plan.version };
        const after = { name: body.name, version: body.version + 1, verdict: result.verdict.kind };
        await writeAudit(trx, { at: save.at, actorId: viewer.id, action: 'plan.update', entity: 'plan', entityId: plan.id, before, after });
      });
      res.json(await planView(db, (await findPlan(db, plan.id))!));
    }),
  );

  router.post(
    '/:id/attach',
    validate({ params: idParams, body: planAttachBody }, async ({ params, body }, req, res) => {
      const viewer = viewerOf(req);
      const plan = await loadPlan(db, viewer, params.id);
      if (plan.buildId !== null) throw attachedConflict();
      const build = await findBuild(db, body.buildId);
      if (!build || build.locationId !== plan.locationId) throw invalidField('buildId', 'Choose a build at the location of the plan');
      const afterDelivery = `Quick plan "${plan.name}" attached after delivery`;
      const correction = authorizeBuildChange(viewer, build, 'update', afterDelivery);
      if (!canOnPlan(viewer, 'update', plan)) throw forbidden('You cannot change plans at this location');
      if (await findBuildPlan(db, build.id)) throw conflict(`Build ${build.number} already has a power plan`, { buildId: 'This build already has a power plan' });
      // Evaluated again, as with every save, so inputs today's computation refuses are not attached.
      const input = JSON.parse(plan.input) as PlanInput;
      const result = evaluateInput(input);
      await db.transaction().execute(async (trx) => {
        const save = { at: now().toISOString(), actorId: viewer.id, input, note: `Attached to ${build.number}` };
        await revisePlan(trx, plan.id, body.version, save, { buildId: build.id });
        await keepPlanMargins(trx, build.id, result);
        if (correction) await addBuildEvent(trx, { buildId: build.id, at: save.at, actorId: viewer.id, kind: 'correction', note: afterDelivery });
        const after = { buildId: build.id, version: body.version + 1, note: save.note };
        await writeAudit(trx, { at: save.at, actorId: viewer.id, action: 'plan.attach', entity: 'plan', entityId: plan.id, before: { buildId: null, version: plan.version }, after });
      });
      res.json(await planView(db, (await findPlan(db, plan.id))!));
    }),
  );

  return router;
}
