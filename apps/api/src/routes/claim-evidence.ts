import { claimRuleSubject, evidenceDelete, evidenceFileQuery, evidenceParams, idParams } from '@busbar/shared';
import { Router } from 'express';
import { claimDetail, loadClaim } from '../access/claims.ts';
import type { AppContext } from '../context.ts';
import { conflict, forbidden, invalidField, notFound } from '../errors.ts';
import { cleanFileName, detectEvidenceType } from '../evidence/file-type.ts';
import { receiveFile } from '../evidence/receive.ts';
import { discardEvidence, readEvidence, storeEvidence } from '../evidence/store.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { writeAudit } from '../queries/audit.ts';
import { liveEvidence } from '../queries/evidence.ts';

/** Photos and documents of a claim: uploaded by those who work it, served to those who may read it, deletions recorded. */
export function claimEvidenceRouter({ db, config, now }: AppContext): Router {
  const router = Router();

  async function workableClaim(req: Parameters<typeof viewerOf>[0], id: number) {
    const viewer = viewerOf(req);
    const claim = await loadClaim(db, viewer, id);
    if (!viewer.ability.can('update', claimRuleSubject(claim))) throw forbidden('You cannot change the evidence of this claim');
    if (claim.status === 'closed') throw conflict('A closed claim takes no more evidence');
    return { viewer, claim };
  }

  router.post(
    '/:id/evidence',
    validate({ params: idParams }, async ({ params }, req, res) => {
      // Permission first, so nobody else's upload is even read.
      const { viewer, claim } = await workableClaim(req, params.id);
      const file = await receiveFile(req, res);
      const type = detectEvidenceType(file.buffer);
      if (!type) throw invalidField('file', 'Upload a JPEG, PNG, WebP or HEIC photo, or a PDF');
      const stored = await storeEvidence(config.dataDir, file.buffer, type);
      const values = { claimId: claim.id, fileName: cleanFileName(file.originalname, type), contentType: type, sizeBytes: file.size };
      try {
        await db.transaction().execute(async (trx) => {
          const at = now().toISOString();
          const row = await trx
            .insertInto('claimEvidence')
            .values({ ...values, storedName: stored.storedName, hasThumbnail: stored.hasThumbnail ? 1 : 0, uploadedBy: viewer.id, uploadedAt: at })
            .returning('id')
            .executeTakeFirstOrThrow();
          await writeAudit(trx, { at, actorId: viewer.id, action: 'claim.evidence.add', entity: 'claim', entityId: claim.id, after: { evidenceId: row.id, ...values } });
        });
      } catch (error) {
        await discardEvidence(config.dataDir, stored.storedName);
        throw error;
      }
      res.status(201).json(await claimDetail(db, viewer, claim.id, now()));
    }),
  );

  router.get(
    '/:id/evidence/:evidenceId',
    validate({ params: evidenceParams, query: evidenceFileQuery }, async ({ params, query }, req, res) => {
      const claim = await loadClaim(db, viewerOf(req), params.id);
      const evidence = await liveEvidence(db, claim.id, params.evidenceId);
      if (!evidence || (query.thumbnail && !evidence.hasThumbnail)) throw notFound('file');
      const bytes = await readEvidence(config.dataDir, evidence.storedName, Boolean(query.thumbnail));
      const inline = evidence.contentType.startsWith('image/') && evidence.contentType !== 'image/heic';
      res.set({
        'Content-Type': query.thumbnail ? 'image/jpeg' : evidence.contentType,
        'Content-Disposition': `${inline ? 'inline' : 'attachment'}; filename*=UTF-8''${encodeURIComponent(evidence.fileName)}`,
        'X-Content-Type-Options': 'nosniff',
        'Cache-Control': 'private, no-store',
      });
      res.send(bytes);
    }),
  );

  router.delete(
    '/:id/evidence/:evidenceId',
    validate({ params: evidenceParams, body: evidenceDelete }, async ({ params, body }, req, res) => {
      const { viewer, claim } = await workableClaim(req, params.id);
      const evidence = await liveEvidence(db, claim.id, params.evidenceId);
      if (!evidence) throw notFound('file');
      await db.transaction().execute(async (trx) => {
        const at = now().toISOString();
        await trx.updateTable('claimEvidence').set({ deletedAt: at, deletedBy: viewer.id, deleteReason: body.reason }).where('id', '=', evidence.id).execute();
        await writeAudit(trx, { at, actorId: viewer.id, action: 'claim.evidence.delete', entity: 'claim', entityId: claim.id, before: { evidenceId: evidence.id, fileName: evidence.fileName }, after: { reason: body.reason } });
      });
      await discardEvidence(config.dataDir, evidence.storedName);
      res.json(await claimDetail(db, viewer, claim.id, now()));
    }),
  );

  return router;
}
