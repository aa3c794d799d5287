/**
 * Who a session is and who its user is, remembered by this process for a few seconds.
 *
 * Every API request needs the session row and the user row; read from the database each time
 * they queue all requests behind one another on the embedded database's one connection. This
 * process keeps what it read for `ttlMs` and forgets at once what it changes itself (its own
 * sign-ins, sign-outs and account changes), so:
 * - on the process that handled a sign-out, deactivation or role change it holds at once;
 * - on every other process (API processes sharing a database) within `ttlMs`, the bound
 *   AUTH_CACHE_SECONDS states: an entry older than that is read again.
 * Nothing here depends on the database engine: it caches what the store and `sessionUser` return.
 */
import type { SessionUser } from '@swardwise/domain';

interface SessionEntry {
  /** When this process read or wrote it (ms, the cache's clock). */
  at: number;
  /** The session as stored, serialised: every reader gets its own copy to change. */
  json: string;
  expiresAt: number;
  userId: number | null;
}

interface UserEntry {
  at: number;
  /** Undefined: no active account (gone, deactivated or not yet accepted). */
  user: SessionUser | undefined;
}

/** Entries kept at most; past it stale ones go, then the oldest. */
const MAX_ENTRIES = 10_000;
/** Past this, forgetting when a session was last touched only costs one early write. */
const MAX_TOUCH_MEMORY_MS = 60 * 60_000;

export class AuthCache {
  private readonly sessions = new Map<string, SessionEntry>();
  private readonly users = new Map<number, UserEntry>();
  /** When this process last wrote each session's expiry, and what it wrote (ms): touches in between are skipped. */
  private readonly touched = new Map<string, { at: number; expiresAt: number }>();
  /**
   * Counts what this process changed: a read begun before a change may have seen the old rows,
   * so what it found is not kept (`put…(…, since)`).
   */
  generation = 0;

  constructor(
    /** How long an entry read from the database is trusted (ms); 0 reads every time. */
    readonly ttlMs: number,
    private readonly now: () => number = () => Date.now(),
  ) {}

  private fresh(at: number): boolean {
    return this.ttlMs > 0 && this.now() - at < this.ttlMs;
  }

  /** The stored session (a copy) and its expiry, when read within the bound; undefined: ask the store. */
  session(sid: string): { data: Record<string, unknown> | null; expiresAt: number } | undefined {
    const entry = this.sessions.get(sid);
    if (!entry) return undefined;
    if (!this.fresh(entry.at)) {
      this.sessions.delete(sid);
      return undefined;
    }
    return { data: entry.json ? (JSON.parse(entry.json) as Record<string, unknown>) : null, expiresAt: entry.expiresAt };
  }

  /** Remembers a session as read or written (data null: there is none, which is worth remembering too). */
  putSession(sid: string, data: Record<string, unknown> | null, expiresAt: number, since = this.generation): void {
    if (this.ttlMs <= 0 || since !== this.generation) return;
    bound(this.sessions, (e) => this.fresh(e.at));
    const userId = data && typeof data.userId === 'number' ? data.userId : null;
    this.sessions.set(sid, { at: this.now(), json: data ? JSON.stringify(data) : '', expiresAt, userId });
  }

  /** A session's expiry was written: the cached copy expires with it. */
  extendSession(sid: string, expiresAt: number): void {
    const entry = this.sessions.get(sid);
    if (entry) entry.expiresAt = expiresAt;
  }

  forgetSession(sid: string): void {
    this.generation += 1;
    this.sessions.delete(sid);
    this.touched.delete(sid);
  }

  /** The active user behind an id, when read within the bound; `{ user: undefined }` is a known refusal. */
  user(id: number): { user: SessionUser | undefined } | undefined {
    const entry = this.users.get(id);
    if (!entry) return undefined;
    if (!this.fresh(entry.at)) {
      this.users.delete(id);
      return undefined;
    }
    return { user: entry.user };
  }

  putUser(id: number, user: SessionUser | undefined, since = this.generation): void {
    if (this.ttlMs <= 0 || since !== this.generation) return;
    bound(this.users, (e) => this.fresh(e.at));
    this.users.set(id, { at: this.now(), user });
  }

  /**
   * This process wrote to the database (any write request): accounts, their sites and their
   * sessions may have changed by any path (an administrator's change, a password reset, a site
   * removed from a partner), so every user and session is read again.
   */
  changed(): void {
    this.generation += 1;
    this.users.clear();
    this.sessions.clear();
  }

  /**
   * Whether a session's expiry is due to be written again: at most once per `intervalMs` per
   * session on this process, unless it moves earlier (the absolute limit drawing near), which
   * is written at once. Records the write when it is due.
   */
  touchDue(sid: string, expiresAt: number, intervalMs: number): boolean {
    const now = this.now();
    const last = this.touched.get(sid);
    if (last !== undefined && now - last.at < intervalMs && expiresAt >= last.expiresAt) return false;
    this.wrote(sid, expiresAt);
    return true;
  }

  /** A session's expiry was written: the next touch is due an interval later. */
  wrote(sid: string, expiresAt: number): void {
    const now = this.now();
    bound(this.touched, (t) => now - t.at < MAX_TOUCH_MEMORY_MS);
    this.touched.set(sid, { at: now, expiresAt });
  }
}

/** Keeps a map under MAX_ENTRIES: drops the entries no longer kept, then the oldest. */
function bound<K, V>(map: Map<K, V>, keep: (v: V) => boolean): void {
  if (map.size < MAX_ENTRIES) return;
  for (const [k, v] of map) if (!keep(v)) map.delete(k);
  while (map.size >= MAX_ENTRIES) map.delete(map.keys().next().value as K);
}
