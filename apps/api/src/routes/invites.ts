import { randomBytes } from 'node:crypto';
import type { Db } from '@busbar/db';
import { acceptInviteBody, idParams, inviteBody, inviteTokenParams, ROLE_LABELS, scopeFor, type Role } from '@busbar/shared';
import { Router, type Request, type Response } from 'express';
import { authorizeGrant, canManagePerson, loadStaffPerson } from '../access/staff.ts';
import { hashPassword } from '../auth/password.ts';
import { checkNewPassword } from '../auth/password-rule.ts';
import type { AppContext } from '../context.ts';
import { conflict, forbidden, HttpError, notFound } from '../errors.ts';
import { countMail, newInviteLimits, reinviteLimits } from '../mail/limits.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { insertAssignment } from '../queries/assignments.ts';
import { writeAudit } from '../queries/audit.ts';
import { claimInvite, closeInvitesOf, findOpenInvite, insertInvite } from '../queries/invites.ts';
import { activateWithPassword, emailTaken, insertInvitedUser } from '../queries/users.ts';
import { signIn } from './session.ts';

function inviteText(name: string, inviter: string, role: Role, link: string, hours: number): string {
  return [
    `Hello ${name},`,
    '',
    `${inviter} has invited you to Busbar as ${ROLE_LABELS[role].toLowerCase()}.`,
    'Set your password with this link to sign in:',
    '',
    link,
    '',
    `The link works once and expires in ${hours} hours. If you did not expect this, ignore this e-mail.`,
  ].join('\n');
}

/** Invites (by a lead, manager or owner) and their acceptance by the invited person. */
export function invitesRouter(ctx: AppContext): { staff: Router; public: Router } {
  const { db, config, mailer, now } = ctx;

  /**
   * Mails a fresh single-use link, then stores it (closing older links) with `write` in one
   * transaction. The mail goes first: when SMTP fails nothing has been written.
   */
  async function sendInvite(
    to: { email: string; name: string },
    invitedBy: { id: number; name: string },
    role: Role,
    write: (trx: Db) => Promise<number>,
  ): Promise<number> {
    const token = randomBytes(32).toString('base64url');
    const link = `${config.publicUrl}/set-password?token=${token}`;
    await mailer.send({
      to: to.email,
      subject: 'Your Busbar invitation',
      text: inviteText(to.name, invitedBy.name, role, link, config.inviteTtlHours),
      secret: token,
    });
    const at = now();
    const expiresAt = new Date(at.getTime() + config.inviteTtlHours * 3_600_000).toISOString();
    return db.transaction().execute(async (trx) => {
      const userId = await write(trx);
      await closeInvitesOf(trx, userId, at.toISOString());
      await insertInvite(trx, { userId, token, createdAt: at.toISOString(), createdBy: invitedBy.id, expiresAt });
      return userId;
    });
  }

  const staff = Router();
  staff.post(
    '/invites',
    validate({ body: inviteBody }, async ({ body }, req, res) => {
      const viewer = viewerOf(req);
      const target = { role: body.role, scope: scopeFor(body.role, body)!, regionId: body.regionId ?? null, locationId: body.locationId ?? null };
      await authorizeGrant(db, viewer, target);
      if (await emailTaken(db, body.email)) {
        throw conflict('Someone with this e-mail already has an account: grant them the role instead', { email: 'Already has an account' });
      }
      await countMail(db, newInviteLimits(viewer.id), now());
      const userId = await sendInvite(body, viewer, body.role, async (trx) => {
        const at = now().toISOString();
        const id = await insertInvitedUser(trx, { email: body.email, name: body.name, createdAt: at });
        const assignmentId = await insertAssignment(trx, { userId: id, ...target, createdAt: at, createdBy: viewer.id });
        await writeAudit(trx, { at, actorId: viewer.id, action: 'person.invite', entity: 'user', entityId: id, after: { email: body.email, name: body.name, status: 'invited' } });
        await writeAudit(trx, { at, actorId: viewer.id, action: 'role.grant', entity: 'role_assignment', entityId: assignmentId, after: { userId: id, ...target } });
        return id;
      });
      res.status(201).json((await loadStaffPerson(db, viewer, userId)).person);
    }),
  );

  staff.post(
    '/:id/invite',
    validate({ params: idParams }, async ({ params }, req, res) => {
      const viewer = viewerOf(req);
      const { person, assignments } = await loadStaffPerson(db, viewer, params.id);
      if (!canManagePerson(viewer, person.id, assignments)) throw forbidden('You cannot invite this person');
      if (person.status !== 'invited') throw conflict('Only people who have not yet accepted an invite can be sent a new one');
      await countMail(db, reinviteLimits(person.id, viewer.id), now());
      await sendInvite(person, viewer, assignments[0]?.role ?? 'technician', async (trx) => {
        await writeAudit(trx, { at: now().toISOString(), actorId: viewer.id, action: 'person.reinvite', entity: 'user', entityId: person.id });
        return person.id;
      });
      res.status(204).end();
    }),
  );

  /** A valid open invite, or the reason it is not. */
  async function openInvite(token: string) {
    const invite = await findOpenInvite(db, token);
    if (!invite || invite.status !== 'invited') throw notFound('invite: this link was already used or is not valid');
    if (invite.expiresAt <= now().toISOString()) {
      throw new HttpError(410, 'invite_expired', 'This invite link has expired. Ask for a new one.');
    }
    return invite;
  }

  const open = Router();
  open.get(
    '/:token',
    validate({ params: inviteTokenParams }, async ({ params }, _req, res) => {
      const { email, name, expiresAt } = await openInvite(params.token);
      res.json({ email, name, expiresAt });
    }),
  );
  open.post(
    '/accept',
    validate({ body: acceptInviteBody }, async ({ body }, req: Request, res: Response) => {
      const invite = await openInvite(body.token);
      await checkNewPassword(body.password, invite);
      const passwordHash = await hashPassword(body.password, config.scryptLogN);
      await db.transaction().execute(async (trx) => {
        const at = now().toISOString();
        // Claimed inside the transaction: of two requests racing with one link, only one wins.
        if (!(await claimInvite(trx, invite.id, at))) throw notFound('invite: this link was already used or is not valid');
        await activateWithPassword(trx, invite.userId, passwordHash);
        await closeInvitesOf(trx, invite.userId, at);
        await writeAudit(trx, { at, actorId: invite.userId, action: 'person.accept_invite', entity: 'user', entityId: invite.userId, before: { status: 'invited' }, after: { status: 'active' } });
      });
      await signIn(ctx, req, res, invite.userId);
    }),
  );
  return { staff, public: open };
}
