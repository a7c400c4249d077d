import { grantRoleBody, idParams, roleParams, scopeFor, staffQuery, type StaffPerson } from '@busbar/shared';
import { Router } from 'express';
import {
  authorizeGrant,
  canManagePerson,
  canReadAssignment,
  canRemoveAssignment,
  holdingsOf,
  loadStaffPerson,
  seesEveryone,
  staffView,
  staffViewAfterChange,
} from '../access/staff.ts';
import type { AppContext } from '../context.ts';
import { conflict, forbidden, notFound } from '../errors.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { assignmentsOf, countActiveOwners, deleteAssignment, insertAssignment } from '../queries/assignments.ts';
import { writeAudit } from '../queries/audit.ts';
import { closeInvitesOf } from '../queries/invites.ts';
import { endSessionsOf, hasPassword, pageUsers, setUserStatus } from '../queries/users.ts';

/** Staff of the locations a person may see: list, roles granted and removed, deactivation. */
export function staffRouter({ db, now }: AppContext): Router {
  const router = Router();

  router.get(
    '/',
    validate({ query: staffQuery }, async ({ query }, req, res) => {
      const viewer = viewerOf(req);
      const holding = seesEveryone(viewer.ability) && !query.locationId ? undefined : await holdingsOf(db, viewer, query.locationId);
      const { rows, ...count } = await pageUsers(db, { ...query, holding });
      const assignments = await assignmentsOf(db, rows.map((u) => u.id));
      const items = rows.map((u) => staffView(viewer, u, assignments)).filter((p): p is StaffPerson => p !== null);
      res.json({ items, ...count, page: query.page, pageSize: query.pageSize });
    }),
  );

  router.get(
    '/:id',
    validate({ params: idParams }, async ({ params }, req, res) => {
      res.json((await loadStaffPerson(db, viewerOf(req), params.id)).person);
    }),
  );

  router.post(
    '/:id/roles',
    validate({ params: idParams, body: grantRoleBody }, async ({ params, body }, req, res) => {
      const viewer = viewerOf(req);
      const { person, assignments } = await loadStaffPerson(db, viewer, params.id);
      const target = { role: body.role, scope: scopeFor(body.role, body)!, regionId: body.regionId ?? null, locationId: body.locationId ?? null };
      await authorizeGrant(db, viewer, target);
      if (person.status === 'inactive') throw conflict('This person is deactivated. Reactivate them first.');
      const same = assignments.some(
        (a) => a.role === target.role && a.regionId === target.regionId && a.locationId === target.locationId,
      );
      if (same) throw conflict('This person already holds that role there', { role: 'Already held' });
      await db.transaction().execute(async (trx) => {
        const at = now().toISOString();
        const id = await insertAssignment(trx, { userId: person.id, ...target, createdAt: at, createdBy: viewer.id });
        await writeAudit(trx, { at, actorId: viewer.id, action: 'role.grant', entity: 'role_assignment', entityId: id, after: { userId: person.id, ...target } });
      });
      res.status(201).json((await loadStaffPerson(db, viewer, person.id)).person);
    }),
  );

  router.delete(
    '/:id/roles/:assignmentId',
    validate({ params: roleParams }, async ({ params }, req, res) => {
      const viewer = viewerOf(req);
      const { assignments } = await loadStaffPerson(db, viewer, params.id);
      const assignment = assignments.find((a) => a.id === params.assignmentId);
      if (!assignment || !canReadAssignment(viewer.ability, assignment)) throw notFound('role assignment');
      if (!canRemoveAssignment(viewer.ability, assignment)) throw forbidden('You cannot remove this role');
      await db.transaction().execute(async (trx) => {
        if (assignment.role === 'owner' && (await countActiveOwners(trx)) <= 1) {
          throw conflict('The network must keep at least one owner');
        }
        await deleteAssignment(trx, assignment.id);
        const { userId: _, ...before } = assignment;
        await writeAudit(trx, { at: now().toISOString(), actorId: viewer.id, action: 'role.remove', entity: 'role_assignment', entityId: assignment.id, before: { userId: params.id, ...before } });
      });
      res.json(await staffViewAfterChange(db, viewer, params.id));
    }),
  );

  for (const action of ['deactivate', 'reactivate'] as const) {
    router.post(
      `/:id/${action}`,
      validate({ params: idParams }, async ({ params }, req, res) => {
        const viewer = viewerOf(req);
        const { person, assignments } = await loadStaffPerson(db, viewer, params.id);
        if (person.id === viewer.id) throw conflict('You cannot change your own access');
        if (!canManagePerson(viewer, person.id, assignments)) throw forbidden('You cannot change this person\'s access');
        if ((action === 'deactivate') === (person.status === 'inactive')) {
          throw conflict(action === 'deactivate' ? 'This person is already deactivated' : 'This person is not deactivated');
        }
        const status = action === 'deactivate' ? 'inactive' : (await hasPassword(db, person.id)) ? 'active' : 'invited';
        await db.transaction().execute(async (trx) => {
          if (action === 'deactivate' && assignments.some((a) => a.role === 'owner') && (await countActiveOwners(trx)) <= 1) {
            throw conflict('The network must keep at least one owner');
          }
          await setUserStatus(trx, person.id, status);
          if (status === 'inactive') {
            await endSessionsOf(trx, person.id);
            await closeInvitesOf(trx, person.id, now().toISOString());
          }
          await writeAudit(trx, { at: now().toISOString(), actorId: viewer.id, action: `person.${action}`, entity: 'user', entityId: person.id, before: { status: person.status }, after: { status } });
        });
        res.json((await loadStaffPerson(db, viewer, person.id)).person);
      }),
    );
  }

  return router;
}
