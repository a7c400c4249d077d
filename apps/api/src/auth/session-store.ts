import type { Db } from '@busbar/db';
import session from 'express-session';

type Callback<T = void> = (err?: unknown, value?: T) => void;

/** express-session store in the application's own database, so sessions survive a restart. */
export class DbSessionStore extends session.Store {
  constructor(
    private readonly db: Db,
    private readonly now: () => Date,
  ) {
    super();
  }

  /** From the injected clock, not the cookie's wall-clock expiry, so the app keeps one time. */
  private expiry(sess: session.SessionData): string {
    const lifetimeMs = sess.cookie?.originalMaxAge ?? 86_400_000;
    return new Date(this.now().getTime() + lifetimeMs).toISOString();
  }

  override get(sid: string, cb: Callback<session.SessionData | null>): void {
    this.db
      .selectFrom('sessions')
      .select(['data', 'expiresAt'])
      .where('sid', '=', sid)
      .executeTakeFirst()
      .then((row) => cb(null, row && row.expiresAt > this.now().toISOString() ? JSON.parse(row.data) : null), cb);
  }

  override set(sid: string, sess: session.SessionData, cb?: Callback): void {
    const row = { data: JSON.stringify(sess), expiresAt: this.expiry(sess), userId: sess.userId ?? null };
    this.db
      .insertInto('sessions')
      .values({ sid, ...row })
      .onConflict((oc) => oc.column('sid').doUpdateSet(row))
      .execute()
      .then(() => cb?.(), cb);
  }

  override destroy(sid: string, cb?: Callback): void {
    this.db
      .deleteFrom('sessions')
      .where('sid', '=', sid)
      .execute()
      .then(() => cb?.(), cb);
  }

  override touch(sid: string, sess: session.SessionData, cb?: Callback): void {
    this.db
      .updateTable('sessions')
      .set({ expiresAt: this.expiry(sess) })
      .where('sid', '=', sid)
      .execute()
      .then(() => cb?.(), cb);
  }
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
