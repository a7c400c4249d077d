import type { Db } from '@busbar/db';
import session from 'express-session';

type Callback<T = void> = (err?: unknown, value?: T) => void;

/** Sessions whose expiry the store remembers; past this many it forgets them all and writes on their next touch. */
const MAX_REMEMBERED = 100_000;

/**
 * express-session store in the application's own database, so sessions survive a restart.
 * A session in use is kept alive by `touch`, which rewrites the row only once less than half of
 * its lifetime is left (sliding expiry renewed at half-life), not on every request.
 */
export class DbSessionStore extends session.Store {
  /** The expiry last read or written for each session id, in ms. */
  private readonly expiries = new Map<string, number>();

  constructor(
    private readonly db: Db,
    private readonly now: () => Date,
  ) {
    super();
  }

  /** From the injected clock, not the cookie's wall-clock expiry, so the app keeps one time. */
  private expiry(sess: session.SessionData): string {
    return new Date(this.now().getTime() + lifetime(sess)).toISOString();
  }

  private remember(sid: string, expiresAt: string): void {
    if (this.expiries.size >= MAX_REMEMBERED) this.expiries.clear();
    this.expiries.set(sid, Date.parse(expiresAt));
  }

  override get(sid: string, cb: Callback<session.SessionData | null>): void {
    this.db
      .selectFrom('sessions')
      .select(['data', 'expiresAt'])
      .where('sid', '=', sid)
      .executeTakeFirst()
      .then((row) => {
        if (!row || row.expiresAt <= this.now().toISOString()) return cb(null, null);
        this.remember(sid, row.expiresAt);
        cb(null, JSON.parse(row.data));
      }, cb);
  }

  override set(sid: string, sess: session.SessionData, cb?: Callback): void {
    const row = { data: JSON.stringify(sess), expiresAt: this.expiry(sess), userId: sess.userId ?? null };
    this.db
      .insertInto('sessions')
      .values({ sid, ...row })
      .onConflict((oc) => oc.column('sid').doUpdateSet(row))
      .execute()
      .then(() => {
        this.remember(sid, row.expiresAt);
        cb?.();
      }, cb);
  }

  override destroy(sid: string, cb?: Callback): void {
    this.expiries.delete(sid);
    this.db
      .deleteFrom('sessions')
      .where('sid', '=', sid)
      .execute()
      .then(() => cb?.(), cb);
  }

  override touch(sid: string, sess: session.SessionData, cb?: Callback): void {
    const known = this.expiries.get(sid);
    if (known !== undefined && known - this.now().getTime() > lifetime(sess) / 2) return cb?.();
    const expiresAt = this.expiry(sess);
    this.db
      .updateTable('sessions')
      .set({ expiresAt })
      .where('sid', '=', sid)
      .execute()
      .then(() => {
        this.remember(sid, expiresAt);
        cb?.();
      }, cb);
  }
}

function lifetime(sess: session.SessionData): number {
  // express-session works the cookie's original lifetime out from its expiry and the wall clock, so
  // it can come out a millisecond short; sessions last whole seconds.
  return Math.round((sess.cookie?.originalMaxAge ?? 86_400_000) / 1000) * 1000;
}

/** Removes sessions past their expiry; run at start-up and now and then. */
export async function pruneSessions(db: Db, now: Date): Promise<void> {
  await db.deleteFrom('sessions').where('expiresAt', '<=', now.toISOString()).execute();
}

declare module 'express-session' {
  interface SessionData {
    userId: number;
  }
}
