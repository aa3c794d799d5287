/** Mowing crews of a district. */
import { and, asc, eq, sql, type SQL } from 'drizzle-orm';
import { crews, districts, users } from '../db/schema/index.ts';
import { authorize, can, type Ctx } from './context.ts';

export async function listCrews(ctx: Ctx, filter: { districtId?: number | undefined }) {
  authorize(ctx, 'read', 'Crew', ctx.actor.role === 'crew' ? { id: ctx.actor.crewId ?? -1, districtId: ctx.actor.districtId } : undefined);
  const conditions: (SQL | undefined)[] = [];
  if (ctx.actor.role === 'foreman') conditions.push(eq(crews.districtId, ctx.actor.districtId ?? -1));
  if (ctx.actor.role === 'crew') conditions.push(eq(crews.id, ctx.actor.crewId ?? -1));
  if (filter.districtId) conditions.push(eq(crews.districtId, filter.districtId));
  const rows = await ctx.db
    .select({
      id: crews.id,
      districtId: crews.districtId,
      districtName: districts.name,
      name: crews.name,
      hoursPerDay: crews.hoursPerDay,
      members: crews.members,
      leadUserId: sql<number | null>`(select min(${users.id}) from ${users} where ${users.crewId} = ${crews.id} and ${users.role} = 'crew')`,
      version: crews.version,
    })
    .from(crews)
    .innerJoin(districts, eq(districts.id, crews.districtId))
    .where(and(...conditions))
    .orderBy(asc(crews.name));
  return rows.filter((row) => can(ctx, 'read', 'Crew', row));
}
