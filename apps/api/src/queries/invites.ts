import { createHash } from 'node:crypto';
import type { Db } from '@busbar/db';

export const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');

export async function insertInvite(
  db: Db,
  values: { userId: number; token: string; createdAt: string; createdBy: number; expiresAt: string },
): Promise<number> {
  const { token, ...rest } = values;
  const row = await db
    .insertInto('invites')
    .values({ ...rest, tokenHash: hashToken(token), usedAt: null })
    .returning('id')
    .executeTakeFirstOrThrow();
  return row.id;
}

/** An unused invite by its token, with the invited person. */
export function findOpenInvite(db: Db, token: string) {
  return db
    .selectFrom('invites as i')
    .innerJoin('users as u', 'u.id', 'i.userId')
    .select(['i.id', 'i.userId', 'i.expiresAt', 'u.email', 'u.name', 'u.status'])
    .where('i.tokenHash', '=', hashToken(token))
    .where('i.usedAt', 'is', null)
    .executeTakeFirst();
}

/** Marks one invite used if it still is open; false when another request used it first. */
export async function claimInvite(db: Db, id: number, at: string): Promise<boolean> {
  const result = await db.updateTable('invites').set({ usedAt: at }).where('id', '=', id).where('usedAt', 'is', null).executeTakeFirst();
  return result.numUpdatedRows === 1n;
}

/** Marks every open invite of a person used, so only the newest link (or none) works. */
export async function closeInvitesOf(db: Db, userId: number, at: string): Promise<void> {
  await db.updateTable('invites').set({ usedAt: at }).where('userId', '=', userId).where('usedAt', 'is', null).execute();
}

export async function deleteInvite(db: Db, id: number): Promise<void> {
  await db.deleteFrom('invites').where('id', '=', id).execute();
}
