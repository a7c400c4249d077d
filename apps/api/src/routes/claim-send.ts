import { claimRuleSubject, claimSend, idParams } from '@busbar/shared';
import { Router } from 'express';
import { claimDetail, loadClaim } from '../access/claims.ts';
import type { AppContext } from '../context.ts';
import { forbidden, invalidField, stale } from '../errors.ts';
import { readEvidence } from '../evidence/store.ts';
import { countMail, vendorRequestLimits } from '../mail/limits.ts';
import { vendorRequest } from '../mail/vendor-request.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { writeAudit } from '../queries/audit.ts';
import { addClaimEvent, changeClaim, dueOnFor } from '../queries/claims.ts';

/** "Send to vendor": e-mails the return request with the evidence, then records it; a failed send changes nothing but is shown on the claim. */
export function claimSendRouter({ db, config, mailer, now }: AppContext): Router {
  const router = Router();
  router.post(
    '/:id/send',
    validate({ params: idParams, body: claimSend }, async ({ params, body }, req, res) => {
      const viewer = viewerOf(req);
      const claim = await loadClaim(db, viewer, params.id);
      if (!viewer.ability.can('send', claimRuleSubject(claim))) throw forbidden('You cannot send this claim to the vendor');
      if (claim.status !== 'evidence_ready') throw invalidField('status', 'Only a claim with its evidence ready is sent to the vendor');
      if (claim.version !== body.version) throw stale();
      await countMail(db, vendorRequestLimits(claim.id, viewer.id), now());
      const [vendor, shop, files] = await Promise.all([
        db.selectFrom('vendors').select(['rmaEmail']).where('id', '=', claim.vendorId).executeTakeFirstOrThrow(),
        db.selectFrom('locations').select(['name']).where('id', '=', claim.locationId).executeTakeFirstOrThrow(),
        db.selectFrom('claimEvidence').select(['fileName', 'storedName', 'contentType']).where('claimId', '=', claim.id).where('deletedAt', 'is', null).orderBy('id').execute(),
      ]);
      const attachments = await Promise.all(files.map(async (f) => ({ filename: f.fileName, contentType: f.contentType, content: await readEvidence(config.dataDir, f.storedName) })));
      const message = vendorRequest(claim, shop, viewer, files.length);
      try {
        await mailer.send({ to: vendor.rmaEmail, ...message, attachments });
      } catch (error) {
        // Nothing changes but the timeline, which says the request did not go, so it is retried.
        await addClaimEvent(db, { claimId: claim.id, at: now().toISOString(), actorId: viewer.id, fromStatus: claim.status, toStatus: claim.status, note: `E-mail to ${vendor.rmaEmail} failed; not sent` });
        throw error;
      }
      await db.transaction().execute(async (trx) => {
        const at = now().toISOString();
        const note = `Return request e-mailed to ${vendor.rmaEmail} with ${files.length} file${files.length === 1 ? '' : 's'}`;
        await changeClaim(trx, claim.id, body.version, at, { status: 'sent_to_vendor', dueOn: dueOnFor('sent_to_vendor', claim.timeZone, now()) });
        await addClaimEvent(trx, { claimId: claim.id, at, actorId: viewer.id, fromStatus: claim.status, toStatus: 'sent_to_vendor', note });
        await writeAudit(trx, { at, actorId: viewer.id, action: 'claim.send', entity: 'claim', entityId: claim.id, before: { status: claim.status }, after: { status: 'sent_to_vendor', to: vendor.rmaEmail, subject: message.subject } });
      });
      res.json(await claimDetail(db, viewer, claim.id, now()));
    }),
  );
  return router;
}
