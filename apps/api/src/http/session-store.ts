/**
 * An express-session store over the `sessions` table, so sessions survive restarts and are
 * shared by API processes. Reads go through the process's `AuthCache` (a session read in the
 * last AUTH_CACHE_SECONDS is not read again) and a session's expiry is written at most once
 * per `touchIntervalMs` (not on every request), so a busy session costs the database nothing
 * most of the time.
 */
import session from 'express-session';
import { eq, lt } from 'drizzle-orm';
import type { Db } from '../db/client.ts';
import { sessions } from '../db/schema/index.ts';
import { AuthCache } from './auth-cache.ts';

const DAY_MS = 24 * 60 * 60 * 1000;

type Callback<T = void> = (err?: unknown, value?: T) => void;

function expiryOf(sess: session.SessionData): Date {
  const expires = sess.cookie?.expires;
  return expires ? new Date(expires) : new Date(Date.now() + DAY_MS);
}

export class DrizzleSessionStore extends session.Store {
  private readonly db: Db;
  readonly cache: AuthCache;
  private readonly touchIntervalMs: number;

  /**
   * `touchIntervalMs`: how often a session's expiry is written while it is in use. The stored
   * expiry may lag the last request by up to this much, so an idle session can end up to this
   * much before SESSION_IDLE_DAYS have passed; never after.
   */
  constructor(db: Db, options: { cache?: AuthCache; touchIntervalMs?: number } = {}) {
    super();
    this.db = db;
    this.cache = options.cache ?? new AuthCache(0);
    this.touchIntervalMs = options.touchIntervalMs ?? 0;
  }

  override get(sid: string, callback: Callback<session.SessionData | null>): void {
    const cached = this.cache.session(sid);
    if (cached) {
      if (!cached.data || cached.expiresAt <= Date.now()) return callback(undefined, null);
      return callback(undefined, cached.data as unknown as session.SessionData);
    }
    const since = this.cache.generation;
    this.db
      .select()
      .from(sessions)
      .where(eq(sessions.sid, sid))
      .then(([row]) => {
        this.cache.putSession(sid, row ? row.data : null, row ? row.expiresAt.getTime() : 0, since);
        if (!row || row.expiresAt.getTime() <= Date.now()) return callback(undefined, null);
        // A copy: express-session changes the object it is given.
        callback(undefined, structuredClone(row.data) as unknown as session.SessionData);
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
      .then(
        () => {
          this.cache.putSession(sid, row.data, row.expiresAt.getTime());
          this.cache.wrote(sid, row.expiresAt.getTime());
          callback?.();
        },
        (err) => {
          this.cache.forgetSession(sid);
          callback?.(err);
        },
      );
  }

  override touch(sid: string, sess: session.SessionData, callback?: Callback): void {
    const expiresAt = expiryOf(sess);
    if (!this.cache.touchDue(sid, expiresAt.getTime(), this.touchIntervalMs)) return callback?.();
    this.db
      .update(sessions)
      .set({ expiresAt })
      .where(eq(sessions.sid, sid))
      .then(
        () => {
          this.cache.extendSession(sid, expiresAt.getTime());
          callback?.();
        },
        (err) => callback?.(err),
      );
  }

  override destroy(sid: string, callback?: Callback): void {
    this.cache.forgetSession(sid);
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
