/**
 * Read-heavy answers (the map, the field list, a field's needs, the sites compare) cached as JSON per caller
 * scope and data fingerprint. PGlite runs one query at a time, so rebuilding 3,000 rows on
 * every request would queue everyone behind it. The fingerprint reads the change counters in
 * `answer_versions`, which `answer_version_*` triggers bump in the same transaction as every
 * write to the tables the answers read, so a cached answer is never stale on any process
 * sharing the database, and reading them costs a few rows however large the city. Requests
 * arriving together share one fingerprint query (`sharedFingerprint`), never one begun before
 * they arrived, and one build of a missing answer (`cachedAnswer`).
 */
import { sql } from 'drizzle-orm';
import { localWriteCount } from '../db/client.ts';
import { answerVersions } from '../db/schema/index.ts';
import type { Ctx } from './context.ts';

/** The tables whose writes `answer_versions` counts (migrations 0021 and 0026). */
export type CountedTable = 'districts' | 'sites' | 'fields' | 'field_checks' | 'weather_stations' | 'weather_days' | 'standards' | 'work_orders' | 'settings' | 'applications' | 'equipment';

/**
 * The change counters of the tables named, or of every counted table: they move whenever a
 * field, check, weather day, station, Standards row, site, district, work order, setting
 * (department parameters, time zone, costs), application or machine is written, added or
 * removed (the triggers of migrations 0021 and 0026 count every write statement on those
 * tables).
 */
async function countersOf(db: Ctx['db'], tables?: readonly CountedTable[]): Promise<string> {
  // Every table's counters come with the database's date: at midnight a crew's window of work moves with the day.
  const named = tables ? sql`where ${answerVersions.scope} in (${sql.join(tables.map((t) => sql`${t}`), sql`, `)})` : sql``;
  const date = tables ? sql`` : sql` || '|' || current_date::text`;
  const res = await db.execute(
    sql`select coalesce(string_agg(${answerVersions.scope} || '=' || ${answerVersions.version}, ',' order by ${answerVersions.scope}), '')${date} as v from ${answerVersions} ${named}`,
  );
  return String((res.rows[0] as { v: string }).v);
}

/**
 * What a caller may see depends only on this: the whole scope of the role (district, crew
 * and sites), never a part of it, so two crews of one district never share an answer.
 */
function scopeKey(ctx: Ctx): string {
  const a = ctx.actor;
  const sites = [...new Set(a.siteIds)].sort((x, y) => x - y).join(',');
  return `${a.role}:d=${a.districtId ?? '-'}:c=${a.crewId ?? '-'}:s=${sites}`;
}

interface Fingerprints {
  /** The query running now, begun before some of its waiters arrived. */
  running: Promise<string> | null;
  /** The next query, not begun yet: everyone arriving now waits for it. */
  next: Promise<string> | null;
}
const fingerprints = new WeakMap<object, Fingerprints>();

/**
 * The fingerprint as of a moment after the call: a query already running may have read the
 * tables before a write this caller has seen, so the caller waits for the next one, which
 * every caller arriving meanwhile shares. Under load this is one query per round instead of
 * one per request; alone, a request runs its own query as before.
 */
export function sharedFingerprint(db: Ctx['db']): Promise<string> {
  let f = fingerprints.get(db);
  if (!f) fingerprints.set(db, (f = { running: null, next: null }));
  const state = f;
  const start = (): Promise<string> => {
    const query = countersOf(db);
    state.running = query;
    const clear = () => {
      if (state.running === query) state.running = null;
    };
    query.then(clear, clear);
    return query;
  };
  if (!state.running) return start();
  state.next ??= state.running.then(
    () => {
      state.next = null;
      return start();
    },
    () => {
      state.next = null;
      return start();
    },
  );
  return state.next;
}

/** Answers kept per kind and database; a field's needs are many (one per field and week). */
const LIMITS: Record<string, number> = { needs: 256 };
const LIMIT = 32;
const caches = new WeakMap<object, Map<string, Map<string, unknown>>>();
/** Builds under way per database and full key: callers missing together wait for one build. */
const building = new WeakMap<object, Map<string, Promise<unknown>>>();

/**
 * The cached entry for (kind, scope, key, fingerprint), built on a miss. One cache per
 * database handle, so test databases never share answers. Fifty callers missing the same
 * entry at once share one build: each build holds the one embedded connection for its
 * queries, so fifty of them queued every request behind the others.
 */
export async function cachedAnswer<T>(ctx: Ctx, kind: string, key: string, build: () => Promise<T>, options: { tables?: readonly CountedTable[] } = {}): Promise<T> {
  // PGlite: this process sees every write, so its own count says as much as the counters
  // table, without a query; the department's date stands in for the database's midnight.
  // An answer that names the tables it reads is kept over writes to the others, for one small query.
  const local = localWriteCount(ctx.db);
  const fingerprint = options.tables
    ? `${await countersOf(ctx.db, options.tables)}|${ctx.clock.today()}`
    : local === undefined
      ? await sharedFingerprint(ctx.db)
      : `w${local}|${ctx.clock.today()}`;
  const full = `${scopeKey(ctx)}|${key}|${fingerprint}`;
  let kinds = caches.get(ctx.db);
  if (!kinds) caches.set(ctx.db, (kinds = new Map()));
  let cache = kinds.get(kind);
  if (!cache) kinds.set(kind, (cache = new Map()));
  if (cache.has(full)) return cache.get(full) as T;
  let pending = building.get(ctx.db);
  if (!pending) building.set(ctx.db, (pending = new Map()));
  const inFlight = pending.get(`${kind}|${full}`);
  if (inFlight) return inFlight as Promise<T>;
  const store = cache;
  const builds = pending;
  const promise = (async () => {
    try {
      const value = await build();
      if (store.size >= (LIMITS[kind] ?? LIMIT)) store.delete(store.keys().next().value!);
      store.set(full, value);
      return value;
    } finally {
      builds.delete(`${kind}|${full}`);
    }
  })();
  builds.set(`${kind}|${full}`, promise);
  return promise;
}
