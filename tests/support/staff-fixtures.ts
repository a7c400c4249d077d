import type { Db } from '@busbar/db';
import type { PersonStatus, Role } from '@busbar/shared';
import type { Agent, Harness } from './api-harness.ts';

/** The demo sign-ins by a short name (see db/demo/network.ts). */
export const SIGN_INS = {
  owner: 'owner@demo.busbar.test',
  regional: 'regional@demo.busbar.test',
  lead: 'lead@demo.busbar.test',
  tech: 'tech@demo.busbar.test',
  warranty: 'warranty@demo.busbar.test',
  accountant: 'accountant@demo.busbar.test',
  lead2: 'lead2@demo.busbar.test',
} as const;
export type SignIn = keyof typeof SIGN_INS;

/** Every demo sign-in signed in to the harness, by short name. */
export async function signInEveryone(h: Pick<Harness, 'signedIn'>): Promise<Record<SignIn, Agent>> {
  const names = Object.keys(SIGN_INS) as SignIn[];
  return Object.fromEntries(await Promise.all(names.map(async (n) => [n, await h.signedIn(SIGN_INS[n])]))) as Record<SignIn, Agent>;
}

let serial = 0;

/** A fresh e-mail no demo person has. */
export const freshEmail = (label = 'person') => `${label}.${++serial}@staff.busbar.test`;

export interface PlacedRole {
  role: Role;
  locationId?: number;
  regionId?: number;
}

/**
 * Writes a person with one role straight into the database, so a test acts on a target of its
 * own that no other test touches. An invited or deactivated person has no password.
 */
export async function addPerson(
  db: Db,
  place: PlacedRole,
  status: PersonStatus = 'active',
): Promise<{ id: number; assignmentId: number; email: string }> {
  const email = freshEmail(place.role);
  const createdAt = '2026-06-01T12:00:00.000Z';
  const user = await db
    .insertInto('users')
    .values({ email, name: `Test ${place.role} ${serial}`, passwordHash: null, status, createdAt })
    .returning('id')
    .executeTakeFirstOrThrow();
  const assignmentId = await addRole(db, user.id, place);
  return { id: user.id, assignmentId, email };
}

/** Gives a person one more role, straight in the database. */
export async function addRole(db: Db, userId: number, place: PlacedRole): Promise<number> {
  const locationId = place.locationId ?? null;
  const regionId = place.regionId ?? null;
  const scope = locationId ? 'location' : regionId ? 'region' : 'network';
  const row = await db
    .insertInto('roleAssignments')
    .values({ userId, role: place.role, scope, regionId, locationId, createdAt: '2026-06-01T12:00:00.000Z', createdBy: null })
    .returning('id')
    .executeTakeFirstOrThrow();
  return row.id;
}

/** Row counts of every table a staff change writes, to show a refused request wrote nothing. */
export async function writtenRows(db: Db) {
  const count = async (table: 'users' | 'roleAssignments' | 'invites' | 'auditLog' | 'mailLog') =>
    Number((await db.selectFrom(table).select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow()).n);
  return {
    users: await count('users'),
    roleAssignments: await count('roleAssignments'),
    invites: await count('invites'),
    auditLog: await count('auditLog'),
    mailLog: await count('mailLog'),
  };
}

/** The token of an invite link as the e-mail carries it. */
export function tokenOf(link: string | null): string {
  const token = link ? new URL(link).searchParams.get('token') : null;
  if (!token) throw new Error(`no invite token in ${String(link)}`);
  return token;
}
