/**
 * A crew's reports from the field: started, done or skipped. A report is stored once per
 * `clientRef` (made by the phone before its first try), so a submission retried after a lost
 * answer is answered again, not counted twice. A done mowing moves the field's last mowing
 * forward and adds the hours to the mower's hour meter.
 */
import { and, asc, eq, sql } from 'drizzle-orm';
import { appError, errors, type ReportAnswer as ReportAnswerOf, type WorkOrderAnswer, type WorkReportInput } from '@swardwise/domain';
import type { Db, Queryable } from '../db/client.ts';
import { crews, equipment, fields, sites, workOrders, workPhotos, workUpdates } from '../db/schema/index.ts';
import { writeAudit } from './audit.ts';
import { authorize, type Ctx } from './context.ts';
import { workOrderColumns } from './work-orders.ts';

/** A report may carry the phone's clock a little ahead of the server's; more is a wrong clock. */
const CLOCK_SKEW_MS = 15 * 60_000;

const orderColumns = { ...workOrderColumns, startedAt: workOrders.startedAt, doneBy: workOrders.doneBy };

/** One work order as the Today page and the board show it. */
async function orderRow(db: Queryable, id: number) {
  const [row] = await db
    .select(orderColumns)
    .from(workOrders)
    .innerJoin(fields, eq(fields.id, workOrders.fieldId))
    .innerJoin(sites, eq(sites.id, workOrders.siteId))
    .leftJoin(crews, eq(crews.id, workOrders.crewId))
    .leftJoin(equipment, eq(equipment.id, workOrders.equipmentId))
    .where(eq(workOrders.id, id));
  return row;
}
export type OrderRow = NonNullable<Awaited<ReturnType<typeof orderRow>>>;

/** The order, if the caller may do `action` on it (404 when there is none, 403 when not his). */
export async function orderFor(ctx: Ctx, id: number, action: 'read' | 'log', db: Queryable = ctx.db): Promise<OrderRow> {
  const row = await orderRow(db, id);
  if (!row) throw errors.notFound('work_order', id);
  authorize(ctx, action, 'WorkOrder', row);
  return row;
}

const updateColumns = {
  id: workUpdates.id,
  status: workUpdates.status,
  actualHours: workUpdates.actualHours,
  note: workUpdates.note,
  reportedAt: workUpdates.reportedAt,
};

const photoUrl = (orderId: number, photoId: number) => `/api/work-orders/${orderId}/photos/${photoId}`;

/** The order with what the crew reported on it and its photos. */
export async function getWorkOrder(ctx: Ctx, id: number): Promise<WorkOrderAnswer<Date>> {
  const order = await orderFor(ctx, id, 'read');
  const updates = await ctx.db
    .select({ ...updateColumns, createdBy: workUpdates.createdBy, createdAt: workUpdates.createdAt })
    .from(workUpdates)
    .where(eq(workUpdates.workOrderId, id))
    .orderBy(asc(workUpdates.reportedAt), asc(workUpdates.id));
  const photos = await ctx.db
    .select({ id: workPhotos.id, width: workPhotos.width, height: workPhotos.height, bytes: workPhotos.bytes, createdAt: workPhotos.createdAt })
    .from(workPhotos)
    .where(eq(workPhotos.workOrderId, id))
    .orderBy(asc(workPhotos.id));
  return { order, updates, photos: photos.map((p) => ({ ...p, url: photoUrl(id, p.id) })) };
}

export type ReportAnswer = ReportAnswerOf<Date>;

async function earlierAnswer(ctx: Ctx, orderId: number, clientRef: string): Promise<ReportAnswer | null> {
  const [update] = await ctx.db
    .select({ ...updateColumns, workOrderId: workUpdates.workOrderId })
    .from(workUpdates)
    .where(eq(workUpdates.clientRef, clientRef));
  if (!update) return null;
  if (update.workOrderId !== orderId) {
    throw appError('work_report/client_ref_taken', 'This report reference was already used for another work order; send the report again as a new one');
  }
  const { workOrderId: _orderId, ...rest } = update;
  void _orderId;
  return { order: (await orderRow(ctx.db, orderId))!, update: rest, duplicate: true };
}

/** What the order may go to from its present status; a done order is closed. */
function checkTransition(current: OrderRow['status'], next: WorkReportInput['status']) {
  if (current !== 'done') return;
  const message =
    next === 'done'
      ? 'This work order is already logged as done; a second done report would count the hours twice'
      : next === 'started'
        ? 'This work order is already done; it cannot be started again'
        : 'This work order is already done; it cannot be skipped now';
  throw appError('work_report/already_done', message, { status: current });
}

function isUniqueViolation(err: unknown): boolean {
  for (let e: unknown = err; e; e = (e as { cause?: unknown }).cause) {
    if ((e as { code?: string }).code === '23505') return true;
  }
  return false;
}

/** Logs a report on a work order; see the module comment for what a done report changes. */
export async function reportWork(ctx: Ctx, id: number, input: WorkReportInput): Promise<ReportAnswer> {
  await orderFor(ctx, id, 'log');
  if (input.clientRef) {
    const earlier = await earlierAnswer(ctx, id, input.clientRef);
    if (earlier) return earlier;
  }
  const reportedAt = input.reportedAt ? new Date(input.reportedAt) : ctx.clock.now();
  if (reportedAt.getTime() > ctx.clock.now().getTime() + CLOCK_SKEW_MS) {
    throw errors.invalid('The report is dated in the future; check the phone’s clock', [{ path: 'body.reportedAt', message: 'the time is in the future' }]);
  }
  // The department's calendar day of the moment reported, whatever the phone's offset.
  const reportedOn = ctx.clock.dateOf(reportedAt);

  try {
    return await (ctx.db as Db).transaction(async (tx) => {
      const before = await orderFor(ctx, id, 'log', tx);
      if (input.version !== undefined && input.version !== before.version) throw errors.versionConflict('work_order');
      checkTransition(before.status, input.status);

      const [update] = await tx
        .insert(workUpdates)
        .values({
          workOrderId: id,
          status: input.status,
          actualHours: input.actualHours,
          note: input.note,
          clientRef: input.clientRef ?? null,
          reportedAt,
          createdBy: ctx.actor.id,
        })
        .returning(updateColumns);

      const changes: Partial<typeof workOrders.$inferInsert> = { status: input.status, pinned: true, updatedAt: new Date() };
      if (input.status === 'started') changes.startedAt = before.startedAt ?? reportedAt;
      if (input.status === 'done') Object.assign(changes, { actualHours: input.actualHours, doneAt: reportedAt, doneBy: ctx.actor.id });
      const [bumped] = await tx
        .update(workOrders)
        .set({ ...changes, version: sql`${workOrders.version} + 1` })
        .where(and(eq(workOrders.id, id), eq(workOrders.version, before.version)))
        .returning({ id: workOrders.id });
      if (!bumped) throw errors.versionConflict('work_order');
      const after = (await orderRow(tx, id))!;
      const district = after.districtId;
      await writeAudit(tx, { actorId: ctx.actor.id, action: 'create', entity: 'work_update', entityId: update!.id, districtId: district, before: null, after: { workOrderId: id, ...update!, clientRef: input.clientRef ?? null } });
      await writeAudit(tx, { actorId: ctx.actor.id, action: 'update', entity: 'work_order', entityId: id, districtId: district, before, after });

      if (input.status === 'done') {
        if (after.task === 'mow') await moveLastMowing(ctx, tx, after.fieldId, reportedOn, district);
        if (after.equipmentId != null && input.actualHours) await addMeterHours(ctx, tx, after.equipmentId, input.actualHours, district);
      }
      return { order: after, update: update!, duplicate: false };
    });
  } catch (err) {
    // The same submission arriving twice at once: the other one was stored first.
    if (input.clientRef && isUniqueViolation(err)) {
      const earlier = await earlierAnswer(ctx, id, input.clientRef);
      if (earlier) return earlier;
    }
    throw err;
  }
}

/** Forward only: a late report of an older mowing never moves the date back. */
async function moveLastMowing(ctx: Ctx, tx: Queryable, fieldId: number, on: string, districtId: number) {
  const [before] = await tx.select({ id: fields.id, name: fields.name, lastMowedOn: fields.lastMowedOn }).from(fields).where(eq(fields.id, fieldId));
  if (!before || (before.lastMowedOn && before.lastMowedOn >= on)) return;
  // The field's version stays: the date comes from work records, not from the field's form.
  await tx.update(fields).set({ lastMowedOn: on, updatedAt: new Date() }).where(eq(fields.id, fieldId));
  await writeAudit(tx, { actorId: ctx.actor.id, action: 'update', entity: 'field', entityId: fieldId, districtId, before, after: { ...before, lastMowedOn: on } });
}

/** The machine's hour meter runs with the work; the version moves so an open equipment form cannot write the old reading back. */
async function addMeterHours(ctx: Ctx, tx: Queryable, equipmentId: number, hours: number, districtId: number) {
  const [before] = await tx.select({ id: equipment.id, name: equipment.name, hourMeterH: equipment.hourMeterH, version: equipment.version }).from(equipment).where(eq(equipment.id, equipmentId));
  if (!before) return;
  const [after] = await tx
    .update(equipment)
    .set({ hourMeterH: sql`${equipment.hourMeterH} + ${hours}`, version: sql`${equipment.version} + 1`, updatedAt: new Date() })
    .where(eq(equipment.id, equipmentId))
    .returning({ id: equipment.id, name: equipment.name, hourMeterH: equipment.hourMeterH, version: equipment.version });
  await writeAudit(tx, { actorId: ctx.actor.id, action: 'update', entity: 'equipment', entityId: equipmentId, districtId, before, after: after ?? null });
}
