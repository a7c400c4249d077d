import { claimReplacement, claimRuleSubject, idParams } from '@busbar/shared';
import { Router } from 'express';
import { claimDetail, loadClaim } from '../access/claims.ts';
import type { AppContext } from '../context.ts';
import { conflict, forbidden, invalidField } from '../errors.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { writeAudit } from '../queries/audit.ts';
import { addBuildEvent, serialHolder } from '../queries/build-changes.ts';
import { changeClaim } from '../queries/claims.ts';

/**
 * The unit put in for a failed one: a new line of the same build with its own serial number, its
 * life counted from the day it went in; the failed unit is marked removed that day. No charge to
 * the customer; the build's timeline says what was swapped.
 */
export function claimReplacementRouter({ db, now }: AppContext): Router {
  const router = Router();
  router.post(
    '/:id/replacement',
    validate({ params: idParams, body: claimReplacement }, async ({ params, body }, req, res) => {
      const viewer = viewerOf(req);
      const claim = await loadClaim(db, viewer, params.id);
      if (!viewer.ability.can('update', claimRuleSubject(claim))) throw forbidden('You cannot record a replacement on this claim');
      if (claim.replacementItemId !== null) throw conflict(`The unit was already replaced by serial number ${claim.replacementSerialNumber}`);
      if (claim.status === 'closed') throw conflict('A closed claim takes no replacement');
      if (body.replacedOn < claim.failedOn) throw invalidField('replacedOn', `The unit failed on ${claim.failedOn}: it cannot have been replaced before`);
      const failed = await db.selectFrom('buildItems').select(['catalogItemId']).where('id', '=', claim.buildItemId).executeTakeFirstOrThrow();
      const item = await db.selectFrom('catalogItems').selectAll().where('id', '=', body.catalogItemId ?? failed.catalogItemId).executeTakeFirst();
      if (!item || !item.serialized) throw invalidField('catalogItemId', 'Choose a serialized component from the catalog');
      if (await serialHolder(db, item.sku, body.serialNumber)) {
        const message = `Serial number ${body.serialNumber} of ${item.sku} is already recorded`;
        throw conflict(message, { serialNumber: message });
      }
      await db.transaction().execute(async (trx) => {
        const at = now().toISOString();
        const line = await trx
          .insertInto('buildItems')
          .values({ buildId: claim.buildId, catalogItemId: item.id, sku: item.sku, quantity: 1, serialNumber: body.serialNumber, unitPriceCents: 0, unitCostCents: 0, createdAt: `${body.replacedOn}T12:00:00.000Z` })
          .returning('id')
          .executeTakeFirstOrThrow();
        await trx.updateTable('buildItems').set({ removedOn: body.replacedOn }).where('id', '=', claim.buildItemId).execute();
        await changeClaim(trx, claim.id, body.version, at, { replacementItemId: line.id });
        const note = `Warranty claim ${claim.number}: ${claim.sku} serial ${claim.serialNumber ?? 'unrecorded'} replaced by ${item.sku} serial ${body.serialNumber} on ${body.replacedOn}`;
        await addBuildEvent(trx, { buildId: claim.buildId, at, actorId: viewer.id, kind: 'correction', note });
        await writeAudit(trx, { at, actorId: viewer.id, action: 'claim.replace', entity: 'claim', entityId: claim.id, after: { replacementItemId: line.id, sku: item.sku, serialNumber: body.serialNumber, replacedOn: body.replacedOn } });
      });
      res.json(await claimDetail(db, viewer, claim.id, now()));
    }),
  );
  return router;
}
