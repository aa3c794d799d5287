/**
 * Row-level scope in SQL, so list queries read only the caller's rows. The same rules as
 * the shared abilities; services also check each row against the ability.
 */
import { and, eq, inArray, sql, type SQL } from 'drizzle-orm';
import type { AnyPgColumn, PgSelect } from 'drizzle-orm/pg-core';
import type { Actor } from '@swardwise/domain';
import { fields, sites, users, workOrders } from '../db/schema/index.ts';

/** A crew's work: what it was given in the last fortnight or is given from now on. */
const CREW_WORK_WINDOW_DAYS = 14;

/**
 * The crews with work on a field in the window, for the ability's `crewIds` condition.
 * Goes in the select list of any query over `fields`.
 */
export const fieldCrewIds = sql<number[]>`coalesce((select array_agg(distinct wo.crew_id) from ${workOrders} wo
  where wo.field_id = ${fields.id} and wo.crew_id is not null
    and wo.planned_date >= current_date - ${CREW_WORK_WINDOW_DAYS}::int), '{}')`;

/**
 * Condition on a row's district and site columns for what the actor may read (a foreman and
 * a crew lead: their district; a partner: his sites); undefined means everything.
 */
export function placeScope(actor: Actor, districtId: AnyPgColumn, siteId: AnyPgColumn): SQL | undefined {
  switch (actor.role) {
    case 'admin':
    case 'head':
      return undefined;
    case 'foreman':
    case 'crew':
      return eq(districtId, actor.districtId ?? -1);
    case 'partner':
      return actor.siteIds.length ? inArray(siteId, actor.siteIds) : sql`false`;
  }
}

/** Condition on the `sites` table for what the actor may read; undefined means everything. */
export function siteScope(actor: Actor): SQL | undefined {
  return placeScope(actor, sites.districtId, sites.id);
}

/**
 * Condition on `fields` (joined to `sites`) for what the actor may read: as `siteScope`, and
 * a crew lead only the fields his crew has work on.
 */
export function fieldScope(actor: Actor): SQL | undefined {
  if (actor.role !== 'crew') return siteScope(actor);
  return and(
    siteScope(actor),
    sql`exists (select 1 from ${workOrders} wo where wo.field_id = ${fields.id} and wo.crew_id = ${actor.crewId ?? -1}
      and wo.planned_date >= current_date - ${CREW_WORK_WINDOW_DAYS}::int)`,
  );
}

/**
 * A select (`$dynamic()`) of rows kept on a field, joined with their field (`on.fieldId`), the
 * site that scopes them (`on.siteId`) and the person who made them (`on.by`; a left join).
 */
export function onFieldJoins<Q extends PgSelect>(query: Q, on: { fieldId: AnyPgColumn; siteId: AnyPgColumn; by: AnyPgColumn }) {
  return query
    .innerJoin(fields, eq(fields.id, on.fieldId))
    .innerJoin(sites, eq(sites.id, on.siteId))
    .leftJoin(users, eq(users.id, on.by));
}
