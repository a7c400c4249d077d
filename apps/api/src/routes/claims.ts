import { isoDay, localDay } from '@busbar/calc';
import { CLAIM_STATUS_LABELS, claimCreate, claimRuleSubject, claimQuery, claimStatusChange, claimUpdate, findClaimTransition, idParams } from '@busbar/shared';
import { Router } from 'express';
import { claimDetail, claimView, loadClaim } from '../access/claims.ts';
import { unitToClaim } from '../access/claim-unit.ts';
import { locationScope, narrowScope } from '../access/locations.ts';
import type { AppContext } from '../context.ts';
import { conflict, forbidden, invalidField } from '../errors.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { writeAudit } from '../queries/audit.ts';
import { listClaims } from '../queries/claim-list.ts';
import { addClaimEvent, changeClaim, dueOnFor, nextClaimNumber } from '../queries/claims.ts';
import { countLiveEvidence } from '../queries/evidence.ts';

/** Claims may be edited until the vendor has answered. */
const EDITABLE = ['logged', 'evidence_ready', 'sent_to_vendor'];

/** Warranty claims of the locations a person may see: the queue, logging, edits and the workflow. */
export function claimsRouter({ db, now }: AppContext): Router {
  const router = Router();

  router.get(
    '/',
    validate({ query: claimQuery }, async ({ query }, req, res) => {
      const viewer = viewerOf(req);
      const scope = narrowScope(viewer, locationScope(viewer, 'read', 'Claim'), query);
      const at = now();
      const page = await listClaims(db, scope, query, at);
      res.json({ ...page, items: page.items.map((row) => claimView(row, at)) });
    }),
  );

  router.get(
    '/:id',
    validate({ params: idParams }, async ({ params }, req, res) => {
      res.json(await claimDetail(db, viewerOf(req), params.id, now()));
    }),
  );

  router.post(
    '/',
    validate({ body: claimCreate }, async ({ body }, req, res) => {
      const viewer = viewerOf(req);
      const unit = await unitToClaim(db, viewer, body, now());
      const id = await db.transaction().execute(async (trx) => {
        const at = now().toISOString();
        const { sequence, number } = await nextClaimNumber(trx, { id: unit.locationId, code: unit.code });
        const values = { ...body, locationId: unit.locationId, buildId: unit.buildId, sequence, number, status: 'logged' as const, dueOn: dueOnFor('logged', unit.timeZone, now()) };
        const row = await trx
          .insertInto('warrantyClaims')
          .values({ ...values, catalogItemId: unit.catalogItemId, outOfWarranty: unit.outOfWarranty ? 1 : 0, createdBy: viewer.id, createdAt: at, loggedOn: isoDay(localDay(unit.timeZone, Date.parse(at))), updatedAt: at })
          .returning('id')
          .executeTakeFirstOrThrow();
        await addClaimEvent(trx, { claimId: row.id, at, actorId: viewer.id, fromStatus: null, toStatus: 'logged', note: '' });
        await writeAudit(trx, { at, actorId: viewer.id, action: 'claim.create', entity: 'claim', entityId: row.id, after: { ...values, outOfWarranty: unit.outOfWarranty } });
        return row.id;
      });
      res.status(201).json(await claimDetail(db, viewer, id, now()));
    }),
  );

  router.patch(
    '/:id',
    validate({ params: idParams, body: claimUpdate }, async ({ params, body }, req, res) => {
      const viewer = viewerOf(req);
      const row = await loadClaim(db, viewer, params.id);
      if (!viewer.ability.can('update', claimRuleSubject(row))) throw forbidden('You cannot change this claim');
      if (!EDITABLE.includes(row.status)) throw conflict(`A claim that is ${CLAIM_STATUS_LABELS[row.status].toLowerCase()} can no longer be edited`);
      const { version, ...patch } = body;
      await db.transaction().execute(async (trx) => {
        const at = now().toISOString();
        await changeClaim(trx, row.id, version, at, patch);
        const before = Object.fromEntries(Object.keys(patch).map((k) => [k, row[k as keyof typeof row]]));
        await writeAudit(trx, { at, actorId: viewer.id, action: 'claim.update', entity: 'claim', entityId: row.id, before, after: patch });
      });
      res.json(await claimDetail(db, viewer, row.id, now()));
    }),
  );

  router.post(
    '/:id/status',
    validate({ params: idParams, body: claimStatusChange }, async ({ params, body }, req, res) => {
      const viewer = viewerOf(req);
      const row = await loadClaim(db, viewer, params.id);
      const transition = findClaimTransition(row.status, body.to);
      if (!transition) throw invalidField('to', `A claim cannot go from ${CLAIM_STATUS_LABELS[row.status]} to ${CLAIM_STATUS_LABELS[body.to]}`);
      const approvedCents = body.to === 'approved' ? (body.creditApprovedCents ?? row.creditRequestedCents) : undefined;
      if (!viewer.ability.can(transition.action, claimRuleSubject(row, approvedCents))) {
        const aboveLimit = approvedCents !== undefined && viewer.ability.can(transition.action, claimRuleSubject(row));
        const limit = (row.approvalLimitCents / 100).toLocaleString('en-US', { style: 'currency', currency: 'USD' });
        throw forbidden(aboveLimit ? `This credit is above the location’s approval limit of ${limit}: the regional manager approves it` : 'You cannot make this change of status');
      }
      if (body.to === 'sent_to_vendor') throw invalidField('to', 'Use Send to vendor: it e-mails the return request first');
      if (body.to === 'evidence_ready' && (await countLiveEvidence(db, row.id)) === 0) throw invalidField('to', 'Upload a photo or document of the failure first');
      if (body.to === 'credited' && body.creditReceivedCents === undefined) throw invalidField('creditReceivedCents', 'Enter the credit the vendor gave');
      await db.transaction().execute(async (trx) => {
        const at = now().toISOString();
        const credits = { ...(approvedCents !== undefined && { creditApprovedCents: approvedCents }), ...(body.to === 'credited' && { creditReceivedCents: body.creditReceivedCents }) };
        await changeClaim(trx, row.id, body.version, at, { status: body.to, dueOn: dueOnFor(body.to, row.timeZone, now()), ...credits });
        await addClaimEvent(trx, { claimId: row.id, at, actorId: viewer.id, fromStatus: row.status, toStatus: body.to, note: body.note });
        await writeAudit(trx, { at, actorId: viewer.id, action: 'claim.status', entity: 'claim', entityId: row.id, before: { status: row.status }, after: { status: body.to, note: body.note, ...credits } });
      });
      res.json(await claimDetail(db, viewer, row.id, now()));
    }),
  );

  return router;
}
