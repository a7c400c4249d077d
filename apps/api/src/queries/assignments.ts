import type { Db } from '@busbar/db';
import type { AssignmentView, Role, Scope } from '@busbar/shared';

export type AssignmentRow = AssignmentView & { userId: number };

/** Role assignments with the names of their region or location, for the given people. */
export async function assignmentsOf(db: Db, userIds: number[]): Promise<AssignmentRow[]> {
  if (userIds.length === 0) return [];
  return db
    .selectFrom('roleAssignments as ra')
    .leftJoin('locations as l', 'l.id', 'ra.locationId')
    .leftJoin('regions as r', 'r.id', 'ra.regionId')
    .select([
      'ra.id',
      'ra.userId',
      'ra.role',
      'ra.scope',
      'ra.regionId',
      'r.name as regionName',
      'ra.locationId',
      'l.code as locationCode',
      'l.name as locationName',
    ])
    .where('ra.userId', 'in', userIds)
    .orderBy('ra.id')
    .execute();
}

export interface NewAssignment {
  userId: number;
  role: Role;
  scope: Scope;
  regionId: number | null;
  locationId: number | null;
  createdAt: string;
  createdBy: number;
}

export async function insertAssignment(db: Db, values: NewAssignment): Promise<number> {
  const row = await db.insertInto('roleAssignments').values(values).returning('id').executeTakeFirstOrThrow();
  return row.id;
}

export async function deleteAssignment(db: Db, id: number): Promise<void> {
  await db.deleteFrom('roleAssignments').where('id', '=', id).execute();
}

/** How many active people hold the owner role: the network must always keep one. */
export async function countActiveOwners(db: Db): Promise<number> {
  const row = await db
    .selectFrom('roleAssignments as ra')
    .innerJoin('users as u', 'u.id', 'ra.userId')
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .where('ra.role', '=', 'owner')
    .where('u.status', '=', 'active')
    .executeTakeFirstOrThrow();
  return Number(row.n);
}

/** Active people who may lead a build at a location: its technicians and its leads. */
export function buildLeadsAt(db: Db, locationId: number): Promise<{ id: number; name: string }[]> {
  return db
    .selectFrom('users as u')
    .innerJoin('roleAssignments as ra', 'ra.userId', 'u.id')
    .select(['u.id', 'u.name'])
    .distinct()
    .where('ra.locationId', '=', locationId)
    .where('ra.role', 'in', ['technician', 'location_lead'])
    .where('u.status', '=', 'active')
    .orderBy('u.name')
    .execute();
}
