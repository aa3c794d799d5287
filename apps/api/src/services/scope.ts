/**
 * Row-level scope in SQL, so list queries read only the caller's rows. The same rules as
 * the shared abilities; services also check each row against the ability.
 */
import { eq, inArray, sql, type SQL } from 'drizzle-orm';
import type { Actor } from '@swardwise/domain';
import { sites } from '../db/schema/index.ts';

/** Condition on the `sites` table for what the actor may read; undefined means everything. */
export function siteScope(actor: Actor): SQL | undefined {
  switch (actor.role) {
    case 'admin':
    case 'head':
      return undefined;
    case 'foreman':
    case 'crew':
      return eq(sites.districtId, actor.districtId ?? -1);
    case 'partner':
      return actor.siteIds.length ? inArray(sites.id, actor.siteIds) : sql`false`;
  }
}
