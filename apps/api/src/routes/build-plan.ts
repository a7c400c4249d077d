import type { Db } from '@busbar/db';
import { idParams, planSaveBody } from '@busbar/shared';
import { Router } from 'express';
import { authorizeBuildChange, loadBuild } from '../access/builds.ts';
import { canOnPlan, evaluateInput, planView } from '../access/plans.ts';
import type { Viewer } from '../access/viewer.ts';
import type { AppContext } from '../context.ts';
import { forbidden, notFound, stale } from '../errors.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { writeAudit } from '../queries/audit.ts';
import { addBuildEvent } from '../queries/build-changes.ts';
import { keepPlanMargins } from '../queries/plan-margins.ts';
import { findBuildPlan, findPlan, insertPlan, planRevisions, revisePlan } from '../queries/plans.ts';

/** A build the person may read, with its plan if it has one they may read. */
async function buildWithPlan(db: Db, viewer: Viewer, buildId: number) {
  const build = await loadBuild(db, viewer, buildId);
  const plan = await findBuildPlan(db, build.id);
  if (plan && !canOnPlan(viewer, 'read', plan)) throw notFound('plan');
  return { build, plan };
}

/** The power plan of a build: read, saved in versions, corrected after delivery with a reason. */
export function buildPlanRouter({ db, now }: AppContext): Router {
  const router = Router();

  router.get(
    '/:id/plan',
    validate({ params: idParams }, async ({ params }, req, res) => {
      const { plan } = await buildWithPlan(db, viewerOf(req), params.id);
      res.json({ plan: plan ? await planView(db, plan) : null });
    }),
  );

  router.get(
    '/:id/plan/revisions',
    validate({ params: idParams }, async ({ params }, req, res) => {
      const { plan } = await buildWithPlan(db, viewerOf(req), params.id);
      res.json(plan ? await planRevisions(db, plan.id) : []);
    }),
  );

  router.put(
    '/:id/plan',
    validate({ params: idParams, body: planSaveBody }, async ({ params, body }, req, res) => {
      const viewer = viewerOf(req);
      const { build, plan } = await buildWithPlan(db, viewer, params.id);
      // Planning a build's power is work on the build: its lead technician or the lead, and after delivery only a correction.
      const correction = authorizeBuildChange(viewer, build, 'update', body.correctionNote);
      if (!canOnPlan(viewer, plan ? 'update' : 'create', plan ?? build)) throw forbidden('You cannot plan builds at this location');
      if ((plan?.version ?? 0) !== body.version) throw stale();
      const result = evaluateInput(body.input);
      const id = await db.transaction().execute(async (trx) => {
        const save = { at: now().toISOString(), actorId: viewer.id, input: body.input, note: correction ? body.correctionNote! : '' };
        let planId = plan?.id;
        if (planId) await revisePlan(trx, planId, body.version, save);
        else planId = await insertPlan(trx, { buildId: build.id, locationId: build.locationId, name: build.number }, save);
        await keepPlanMargins(trx, build.id, result);
        if (correction) await addBuildEvent(trx, { buildId: build.id, at: save.at, actorId: viewer.id, kind: 'correction', note: `Power plan: ${save.note}` });
        await writeAudit(trx, {
          at: save.at,
          actorId: viewer.id,
          action: correction ? 'plan.correct' : plan ? 'plan.update' : 'plan.create',
          entity: 'plan',
          entityId: planId,
          before: plan ? { version: plan.version } : undefined,
          after: { buildId: build.id, version: body.version + 1, verdict: result.verdict.kind, note: save.note },
        });
        return planId;
      });
      res.json(await planView(db, (await findPlan(db, id))!));
    }),
  );

  return router;
}
