/** Work orders as each role may read them (the week plan's writes come with the planner). */
import { and, asc, eq, gte, inArray, lte, sql, type SQL } from 'drizzle-orm';
import { crews, fields, sites, workOrders } from '../db/schema/index.ts';
import { authorize, can, type Ctx } from './context.ts';

export interface WorkOrderFilter {
  from: string;
  to: string;
  crewId?: number | undefined;
}

export async function listWorkOrders(ctx: Ctx, filter: WorkOrderFilter) {
  authorize(ctx, 'read', 'WorkOrder');
  const a = ctx.actor;
  const conditions: (SQL | undefined)[] = [gte(workOrders.plannedDate, filter.from), lte(workOrders.plannedDate, filter.to)];
  if (a.role === 'foreman') conditions.push(eq(workOrders.districtId, a.districtId ?? -1));
  if (a.role === 'crew') conditions.push(eq(workOrders.crewId, a.crewId ?? -1));
  if (a.role === 'partner') conditions.push(a.siteIds.length ? inArray(workOrders.siteId, a.siteIds) : sql`false`);
  if (filter.crewId) conditions.push(eq(workOrders.crewId, filter.crewId));
  const rows = await ctx.db
    .select({
      id: workOrders.id,
      fieldId: workOrders.fieldId,
      fieldName: fields.name,
      siteId: workOrders.siteId,
      siteName: sites.name,
      districtId: workOrders.districtId,
      task: workOrders.task,
      plannedDate: workOrders.plannedDate,
      crewId: workOrders.crewId,
      crewName: sql<string | null>`${crews.name}`,
      plannedHours: workOrders.plannedHours,
      actualHours: workOrders.actualHours,
      status: workOrders.status,
      reason: workOrders.reason,
      details: workOrders.details,
      version: workOrders.version,
    })
    .from(workOrders)
    .innerJoin(fields, eq(fields.id, workOrders.fieldId))
    .innerJoin(sites, eq(sites.id, workOrders.siteId))
    .leftJoin(crews, eq(crews.id, workOrders.crewId))
    .where(and(...conditions))
    .orderBy(asc(workOrders.plannedDate), asc(sites.name), asc(fields.name));
  return rows.filter((r) => can(ctx, 'read', 'WorkOrder', r));
}
