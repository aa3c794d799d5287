/**
 * A field's work history: the jobs logged on it (started, done, skipped or reopened), newest
 * first, each with the crew's reports (notes) and photos, so the office reads what the crew saw.
 */
import { and, count, desc, eq, sql } from 'drizzle-orm';
import type { PageQuery, WorkHistoryPage } from '@swardwise/domain';
import { workOrders, workUpdates } from '../db/schema/index.ts';
import { can, type Ctx } from './context.ts';
import { getField } from './fields.ts';
import { readScope, selectWorkOrders } from './work-orders.ts';
import { photosOf, updatesOf } from './work-reports.ts';

export async function fieldWorkHistory(ctx: Ctx, fieldId: number, q: PageQuery): Promise<WorkHistoryPage<Date>> {
  await getField(ctx, fieldId);
  // Logged work: anything a crew reported on, or finished.
  const logged = sql`(${workOrders.status} in ('started', 'done', 'skipped') or exists (select 1 from ${workUpdates} where ${workUpdates.workOrderId} = ${workOrders.id}))`;
  const where = and(eq(workOrders.fieldId, fieldId), readScope(ctx), logged);
  const [{ total } = { total: 0 }] = await ctx.db.select({ total: count() }).from(workOrders).where(where);
  const orders = (
    await selectWorkOrders(ctx.db)
      .where(where)
      .orderBy(desc(sql`coalesce(${workOrders.doneAt}, ${workOrders.plannedDate}::timestamptz)`), desc(workOrders.id))
      .limit(q.pageSize)
      .offset((q.page - 1) * q.pageSize)
  ).filter((o) => can(ctx, 'read', 'WorkOrder', o));
  const ids = orders.map((o) => o.id);
  const [updates, photos] = ids.length ? [await updatesOf(ctx.db, ids), await photosOf(ctx.db, ids)] : [[], []];
  return {
    page: q.page,
    pageSize: q.pageSize,
    total,
    items: orders.map((order) => ({
      order,
      updates: updates.filter((u) => u.workOrderId === order.id).map(({ workOrderId: _w, ...u }) => (void _w, u)),
      photos: photos.filter((p) => p.workOrderId === order.id).map(({ workOrderId: _w, ...p }) => (void _w, p)),
    })),
  };
}
