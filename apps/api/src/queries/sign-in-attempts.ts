import type { Db } from '@busbar/db';

type Kind = 'sign_in' | 'reset';
/** Which attempts to count: by e-mail, by address, or by both. */
type Who = { email?: string; address?: string };

function matching(db: Db, kind: Kind, since: string, who: Who) {
  let query = db.selectFrom('signInAttempts').where('kind', '=', kind).where('at', '>', since);
  if (who.email !== undefined) query = query.where('email', '=', who.email);
  if (who.address !== undefined) query = query.where('address', '=', who.address);
  return query;
}

/** Records one attempt and deletes those of its kind that fell out of the counting window. */
export async function recordAttempt(db: Db, values: { kind: Kind; email: string; address: string; at: string }, since: string): Promise<void> {
  await db.deleteFrom('signInAttempts').where('kind', '=', values.kind).where('at', '<=', since).execute();
  await db.insertInto('signInAttempts').values(values).execute();
}

export async function countAttempts(db: Db, kind: Kind, since: string, who: Who): Promise<number> {
  const row = await matching(db, kind, since, who).select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
  return Number(row.n);
}

/** When the `limit`-th newest attempt was made, or null when there are fewer: the window runs from it. */
export async function limitReachedAt(db: Db, kind: Kind, since: string, who: Who, limit: number): Promise<string | null> {
  const row = await matching(db, kind, since, who).select('at').orderBy('at', 'desc').limit(1).offset(limit - 1).executeTakeFirst();
  return row?.at ?? null;
}

/** Forgets the failures of one account from one address (after it signed in there). */
export async function clearAttempts(db: Db, kind: Kind, who: { email: string; address: string }): Promise<void> {
  await db.deleteFrom('signInAttempts').where('kind', '=', kind).where('email', '=', who.email).where('address', '=', who.address).execute();
}
