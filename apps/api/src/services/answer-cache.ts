/**
 * Read-heavy answers (the map, the field list) cached as JSON per caller scope and data
 * fingerprint. PGlite runs one query at a time, so rebuilding 3,000 rows on every request
 * would queue everyone behind it; the fingerprint is one query that changes with any write
 * to the tables the answers read, so a cached answer is never stale.
 */
import { sql } from 'drizzle-orm';
import { districts, fieldChecks, fields, sites, standards, weatherDays, weatherStations, workOrders } from '../db/schema/index.ts';
import type { Ctx } from './context.ts';

/**
 * Changes whenever a field, check, weather day, station, Standards row, site, district or work
 * order is written, added or removed, and at midnight (a crew's window of work moves with the day).
 */
async function dataFingerprint(db: Ctx['db']): Promise<string> {
  const res = await db.execute(sql`select concat_ws('|',
    (select count(*) || ':' || coalesce(max(${fields.updatedAt})::text, '') || ':' || coalesce(max(${fields.id}), 0)
       || ':' || coalesce(sum(${fields.version}), 0) || ':' || coalesce(sum(${fields.lastMowedOn} - date '2000-01-01'), 0) from ${fields}),
    (select count(*) || ':' || coalesce(max(${fieldChecks.id}), 0) from ${fieldChecks}),
    (select count(*) || ':' || coalesce(max(${weatherDays.updatedAt})::text, '') from ${weatherDays}),
    (select count(*) || ':' || coalesce(max(${weatherStations.updatedAt})::text, '') from ${weatherStations}),
    (select coalesce(sum(${standards.version}), 0) || ':' || coalesce(max(${standards.updatedAt})::text, '') from ${standards}),
    (select count(*) || ':' || coalesce(max(${sites.updatedAt})::text, '') || ':' || coalesce(sum(${sites.version}), 0) from ${sites}),
    (select count(*) || ':' || coalesce(max(${districts.updatedAt})::text, '') from ${districts}),
    (select count(*) || ':' || coalesce(max(${workOrders.updatedAt})::text, '') || ':' || coalesce(sum(${workOrders.version}), 0) from ${workOrders}),
    current_date::text
  ) as v`);
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

const LIMIT = 32;
const caches = new WeakMap<object, Map<string, unknown>>();

/**
 * The cached entry for (kind, scope, key, fingerprint), built on a miss. One cache per
 * database handle, so test databases never share answers.
 */
export async function cachedAnswer<T>(ctx: Ctx, kind: string, key: string, build: () => Promise<T>): Promise<T> {
  const full = `${kind}|${scopeKey(ctx)}|${key}|${await dataFingerprint(ctx.db)}`;
  let cache = caches.get(ctx.db);
  if (!cache) caches.set(ctx.db, (cache = new Map()));
  if (cache.has(full)) return cache.get(full) as T;
  const value = await build();
  if (cache.size >= LIMIT) cache.delete(cache.keys().next().value!);
  cache.set(full, value);
  return value;
}
