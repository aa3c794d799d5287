/** An express-session store over the `sessions` table, so sessions survive restarts and are shared by API processes. */
import session from 'express-session';
import { eq, lt } from 'drizzle-orm';
import type { Db } from '../db/client.ts';
import { sessions } from '../db/schema/index.ts';

const DAY_MS = 24 * 60 * 60 * 1000;

type Callback<T = void> = (err?: unknown, value?: T) => void;

function expiryOf(sess: session.SessionData): Date {
  const expires = sess.cookie?.expires;
  return expires ? new Date(expires) : new Date(Date.now() + DAY_MS);
}

export class DrizzleSessionStore extends session.Store {
  private readonly db: Db;

  constructor(db: Db) {
    super();
    this.db = db;
  }

  override get(sid: string, callback: Callback<session.SessionData | null>): void {
    this.db
      .select()
      .from(sessions)
      .where(eq(sessions.sid, sid))
      .then(([row]) => {
        if (!row || row.expiresAt.getTime() <= Date.now()) return callback(undefined, null);
        callback(undefined, row.data as unknown as session.SessionData);
      }, callback);
  }

  override set(sid: string, sess: session.SessionData, callback?: Callback): void {
    const row = {
      sid,
      userId: sess.userId ?? null,
      data: JSON.parse(JSON.stringify(sess)) as Record<string, unknown>,
      expiresAt: expiryOf(sess),
    };
    this.db
      .insert(sessions)
      .values(row)
      .onConflictDoUpdate({ target: sessions.sid, set: { data: row.data, expiresAt: row.expiresAt, userId: row.userId } })
      .then(() => callback?.(), (err) => callback?.(err));
  }

  override touch(sid: string, sess: session.SessionData, callback?: Callback): void {
    this.db
      .update(sessions)
      .set({ expiresAt: expiryOf(sess) })
      .where(eq(sessions.sid, sid))
      .then(() => callback?.(), (err) => callback?.(err));
  }

  override destroy(sid: string, callback?: Callback): void {
    this.db
      .delete(sessions)
      .where(eq(sessions.sid, sid))
      .then(() => callback?.(), (err) => callback?.(err));
  }

  /** Removes expired sessions; the server calls it now and then. */
  async prune(): Promise<void> {
    await this.db.delete(sessions).where(lt(sessions.expiresAt, new Date()));
  }
}

declare module 'express-session' {
  interface SessionData {
    userId: number;
    /** Set when an administrator ended the session (`services/users.ts` endSessions). */
    endedBecause: 'access_changed' | 'deactivated';
  }
}
