import type { Db } from '@busbar/db';
import { hashToken } from './invites.ts';

/** Ends a person's sessions, all of them or all but one (the one changing the password). */
export async function endSessions(db: Db, userId: number, keepSid?: string): Promise<number> {
  let query = db.deleteFrom('sessions').where('userId', '=', userId);
  if (keepSid !== undefined) query = query.where('sid', '!=', keepSid);
  const result = await query.executeTakeFirst();
  return Number(result.numDeletedRows);
}

export function findPasswordHash(db: Db, userId: number) {
  return db.selectFrom('users').select('passwordHash').where('id', '=', userId).executeTakeFirstOrThrow();
}

export async function insertPasswordReset(db: Db, values: { userId: number; token: string; createdAt: string; expiresAt: string }): Promise<void> {
  const { token, ...rest } = values;
  await db.insertInto('passwordResets').values({ ...rest, tokenHash: hashToken(token), usedAt: null }).execute();
}

/** An unused reset link by its token, with its active person. */
export function findOpenReset(db: Db, token: string) {
  return db
    .selectFrom('passwordResets as r')
    .innerJoin('users as u', 'u.id', 'r.userId')
    .select(['r.id', 'r.userId', 'r.expiresAt', 'u.email', 'u.name'])
    .where('r.tokenHash', '=', hashToken(token))
    .where('r.usedAt', 'is', null)
    .where('u.status', '=', 'active')
    .executeTakeFirst();
}

/** Marks every open link of a person used; true when `id` was among them (of two racing requests, one wins). */
export async function closeResetsOf(db: Db, userId: number, at: string, id?: number): Promise<boolean> {
  const open = await db.selectFrom('passwordResets').select('id').where('userId', '=', userId).where('usedAt', 'is', null).execute();
  await db.updateTable('passwordResets').set({ usedAt: at }).where('userId', '=', userId).where('usedAt', 'is', null).execute();
  return open.some((r) => r.id === id);
}

/** The active person with this e-mail, if any, to mail a reset link to. */
export function findActivePerson(db: Db, email: string) {
  return db.selectFrom('users').select(['id', 'email', 'name']).where('email', '=', email).where('status', '=', 'active').executeTakeFirst();
}
