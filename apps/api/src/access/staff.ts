import type { Db } from '@busbar/db';
import { subject } from '@casl/ability';
import type { AppAbility, Role, Scope, StaffPerson } from '@busbar/shared';
import type { RequestHandler } from 'express';
import { forbidden, notFound } from '../errors.ts';
import { viewerOf } from '../middleware/session.ts';
import { assignmentsOf, type AssignmentRow } from '../queries/assignments.ts';
import { findUser, type Holding, type UserRow } from '../queries/users.ts';
import type { Viewer } from './viewer.ts';

type AssignmentFields = { role: Role; scope: Scope; regionId: number | null; locationId: number | null };

const asSubject = (a: AssignmentFields) =>
  subject('RoleAssignment', { role: a.role, scope: a.scope, regionId: a.regionId, locationId: a.locationId });

/** Whether the viewer reads network-level assignments, and so every person, roles or none (the owner). */
export const seesEveryone = (ability: AppAbility) =>
  ability.can('read', asSubject({ role: 'owner', scope: 'network', regionId: null, locationId: null }));

/**
 * Staff management belongs to leads, regional managers and the owner. Other roles read no
 * assignments anywhere, so every staff route answers them 403, as the audit log does.
 */
export const requireStaffAccess: RequestHandler = (req, _res, next) => {
  if (!viewerOf(req).ability.can('read', 'RoleAssignment')) throw forbidden('Your role does not manage staff');
  next();
};

/** The viewer may deactivate someone only if they could remove every role that person holds. */
export function canManagePerson(viewer: Viewer, personId: number, assignments: AssignmentFields[]): boolean {
  if (personId === viewer.id) return false;
  if (assignments.length === 0) return seesEveryone(viewer.ability);
  return assignments.every((a) => canRemoveAssignment(viewer.ability, a));
}

export const canRemoveAssignment = (ability: AppAbility, a: AssignmentFields) => ability.can('delete', asSubject(a));

export const canReadAssignment = (ability: AppAbility, a: AssignmentFields) => ability.can('read', asSubject(a));

/**
 * Where the viewer reads role assignments, so the staff list is paged in the database: the
 * locations (only `locationId` when the list asks for one) and the regions.
 */
export async function holdingsOf(db: Db, viewer: Viewer, locationId?: number): Promise<Holding> {
  const reads = (on: { locationId: number } | { regionId: number }) => viewer.ability.can('read', subject('RoleAssignment', on));
  if (locationId !== undefined) return { locationIds: reads({ locationId }) ? [locationId] : [], regionIds: [] };
  const regions = await db.selectFrom('regions').select('id').execute();
  return {
    locationIds: viewer.locationIds.filter((id) => reads({ locationId: id })),
    regionIds: regions.map((r) => r.id).filter((id) => reads({ regionId: id })),
  };
}

/** A person as this viewer sees them, or null when the viewer may not see them at all. */
export function staffView(viewer: Viewer, user: UserRow, all: AssignmentRow[]): StaffPerson | null {
  const own = all.filter((a) => a.userId === user.id);
  const visible = own.filter((a) => canReadAssignment(viewer.ability, a)).map(({ userId: _, ...a }) => a);
  if (visible.length === 0 && !seesEveryone(viewer.ability)) return null;
  return { ...user, assignments: visible, canManage: canManagePerson(viewer, user.id, own) };
}

/**
 * A person as the viewer sees them after a change: removing the last role the viewer can see
 * takes the person out of their sight, yet the change happened, so it answers with no roles.
 */
export async function staffViewAfterChange(db: Db, viewer: Viewer, id: number): Promise<StaffPerson> {
  const user = await findUser(db, id);
  if (!user) throw notFound('person');
  return staffView(viewer, user, await assignmentsOf(db, [id])) ?? { ...user, assignments: [], canManage: false };
}

/** Loads one person for the viewer: 404 when missing or out of the viewer's sight. */
export async function loadStaffPerson(db: Db, viewer: Viewer, id: number): Promise<{ person: StaffPerson; assignments: AssignmentRow[] }> {
  const user = await findUser(db, id);
  const assignments = user ? await assignmentsOf(db, [id]) : [];
  const person = user ? staffView(viewer, user, assignments) : null;
  if (!person) throw notFound('person');
  return { person, assignments };
}

/**
 * May the viewer grant this role at this scope? A region or location they cannot see answers
 * 404 like any record outside their scope; one they see but may not staff answers 403.
 */
export async function authorizeGrant(db: Db, viewer: Viewer, target: AssignmentFields): Promise<void> {
  if (target.locationId !== null) {
    const row = await db.selectFrom('locations').select('id').where('id', '=', target.locationId).executeTakeFirst();
    if (!row || !viewer.ability.can('read', subject('Location', { id: row.id }))) throw notFound('location');
  }
  if (target.regionId !== null) {
    const row = await db.selectFrom('regions').select('id').where('id', '=', target.regionId).executeTakeFirst();
    if (!row || !viewer.ability.can('read', subject('Region', { id: row.id }))) throw notFound('region');
  }
  if (!viewer.ability.can('create', asSubject(target))) throw forbidden('You cannot grant this role at this scope');
}
