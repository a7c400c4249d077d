import type { Db } from '@busbar/db';
import type { AssignmentView, Page, Role, Scope } from '@busbar/shared';
import type { LocationScope } from '../access/locations.ts';
import { cappedCount, offsetOf } from './paging.ts';
import { contains } from './search.ts';

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

/** The roles whose holders lead builds at their location. */
const BUILD_LEAD_ROLES: Role[] = ['technician', 'location_lead'];

/**
 * A page of the active people who may lead builds at any location of `scope`, by name: one query
 * for a network of hundreds of shops, where a list per shop would be a request per shop.
 */
export async function pageBuildLeads(db: Db, scope: LocationScope, filter: { q?: string | undefined; id?: number | undefined; page: number; pageSize: number }): Promise<Page<{ id: number; name: string }>> {
  const { q, id, page, pageSize } = filter;
  let people = db
    .selectFrom('users as u')
    .select(['u.id', 'u.name'])
    .where('u.status', '=', 'active')
    // Across the network, people are walked by name, each asked whether they lead builds; a scope's
    // shops find theirs through the location index first (a shop of 200: 0.01 ms instead of 0.66).
    .where((eb) => {
      const leads = eb.selectFrom('roleAssignments as ra').where('ra.role', 'in', BUILD_LEAD_ROLES);
      if (scope === 'all') return eb.exists(leads.select('ra.id').whereRef('ra.userId', '=', 'u.id'));
      return eb('u.id', 'in', leads.select('ra.userId').where('ra.locationId', 'in', scope));
    });
  if (q) people = people.where(contains('u.name', q));
  if (id !== undefined) people = people.where('u.id', '=', id);
  const [items, count] = await Promise.all([
    people.orderBy('u.name').orderBy('u.id').limit(pageSize).offset(offsetOf(page, pageSize)).execute(),
    cappedCount(db, people),
  ]);
  return { items, ...count, page, pageSize };
}

/** Active people who may lead a build at a location: its technicians and its leads. */
export function buildLeadsAt(db: Db, locationId: number): Promise<{ id: number; name: string }[]> {
  return db
    .selectFrom('users as u')
    .innerJoin('roleAssignments as ra', 'ra.userId', 'u.id')
    .select(['u.id', 'u.name'])
    .distinct()
    .where('ra.locationId', '=', locationId)
    .where('ra.role', 'in', BUILD_LEAD_ROLES)
    .where('u.status', '=', 'active')
    .orderBy('u.name')
    .execute();
}
