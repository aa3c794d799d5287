/**
 * A crew's reports from the field: started, done or skipped. A report is stored once per
 * `clientRef` (made by the phone before its first try), so a submission retried after a lost
 * answer is answered again, not counted twice. A done mowing moves the field's last mowing
 * forward and adds the hours to the mower's hour meter; a done sharpening (a yard job) records
 * the machine's hour meter reading as its last sharpening.
 */
import { and, asc, desc, eq, sql } from 'drizzle-orm';
import { AppError, appError, errors, FIELD_STATUS_LABELS, type ReopenAnswer, type ReopenInput, type ReportAnswer as ReportAnswerOf, type WorkOrderAnswer, type WorkPhoto, type WorkReportInput, type WorkUpdateRow } from '@swardwise/domain';
import type { Db, Queryable } from '../db/client.ts';
import { equipment, fields, users, workOrders, workPhotos, workUpdates } from '../db/schema/index.ts';
import { writeAudit } from './audit.ts';
import { authorize, can, type Ctx } from './context.ts';
import { workOrderColumns, workOrderJoins } from './work-orders.ts';

/** A report may carry the phone's clock a little ahead of the server's; more is a wrong clock. */
const CLOCK_SKEW_MS = 15 * 60_000;

const orderColumns = { ...workOrderColumns, startedAt: workOrders.startedAt, doneBy: workOrders.doneBy };

/** One work order as the Today page and the board show it. */
async function orderRow(db: Queryable, id: number) {
  // A yard job has no field and no site; it reads as the district's yard.
  const [row] = await workOrderJoins(db.select(orderColumns).from(workOrders).$dynamic()).where(eq(workOrders.id, id));
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

export const photoUrl = (orderId: number, photoId: number) => `/api/work-orders/${orderId}/photos/${photoId}`;

/** The reports on some orders, oldest first, with who sent each. */
export async function updatesOf(db: Queryable, orderIds: readonly number[]): Promise<Array<WorkUpdateRow<Date> & { workOrderId: number }>> {
  if (orderIds.length === 0) return [];
  return db
    .select({ ...updateColumns, workOrderId: workUpdates.workOrderId, createdBy: workUpdates.createdBy, createdByName: sql<string | null>`${users.name}`, createdAt: workUpdates.createdAt })
    .from(workUpdates)
    .leftJoin(users, eq(users.id, workUpdates.createdBy))
    .where(sql`${workUpdates.workOrderId} in ${orderIds}`)
    .orderBy(asc(workUpdates.reportedAt), asc(workUpdates.id));
}

/** The photos of some orders, in the order they were taken. */
export async function photosOf(db: Queryable, orderIds: readonly number[]): Promise<Array<WorkPhoto<Date> & { workOrderId: number }>> {
  if (orderIds.length === 0) return [];
  const rows = await db
    .select({ id: workPhotos.id, workOrderId: workPhotos.workOrderId, width: workPhotos.width, height: workPhotos.height, bytes: workPhotos.bytes, createdAt: workPhotos.createdAt })
    .from(workPhotos)
    .where(sql`${workPhotos.workOrderId} in ${orderIds}`)
    .orderBy(asc(workPhotos.id));
  return rows.map((p) => ({ ...p, url: photoUrl(p.workOrderId, p.id) }));
}

const strip = <T extends { workOrderId: number }>({ workOrderId: _w, ...rest }: T): Omit<T, 'workOrderId'> => (void _w, rest);

/** The order with what the crew reported on it and its photos. */
export async function getWorkOrder(ctx: Ctx, id: number): Promise<WorkOrderAnswer<Date>> {
  const order = await orderFor(ctx, id, 'read');
  const [updates, photos] = [await updatesOf(ctx.db, [id]), await photosOf(ctx.db, [id])];
  return { order, updates: updates.map(strip), photos: photos.map(strip) };
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

/**
 * A closed field stops the job: work on it cannot be started or logged done until the
 * foreman opens it again (a skip with the reason is how the crew reports it).
 */
function checkFieldOpen(order: OrderRow, next: WorkReportInput['status']) {
  // A check of a closed field is how the foreman learns whether it may open again.
  if (order.fieldStatus !== 'closed' || next === 'skipped' || order.task === 'field_check') return;
  const why = order.fieldStatusNote ? `: ${order.fieldStatusNote}` : '';
  throw appError('work_report/field_closed', `${order.fieldName} is ${FIELD_STATUS_LABELS.closed.toLowerCase()}${why}. The work cannot be ${next === 'done' ? 'logged done' : 'started'} while the field is closed; skip it with the reason or ask your foreman.`, {
    fieldStatus: order.fieldStatus,
    fieldStatusNote: order.fieldStatusNote,
  });
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
      checkFieldOpen(before, input.status);

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

      let order = after;
      if (input.status === 'done') {
        if (after.task === 'mow' && after.fieldId !== null) await moveLastMowing(ctx, tx, after.fieldId, reportedOn, district);
        if (after.task === 'sharpen_blades') order = await recordSharpening(ctx, tx, after, input.hourMeterH);
        // Sharpening hours are the crew's time at the bench, not the engine's.
        else if (after.equipmentId != null && input.actualHours) await addMeterHours(ctx, tx, after.equipmentId, input.actualHours, district);
      }
      return { order, update: update!, duplicate: false };
    });
  } catch (err) {
    // The same submission arriving twice at once: the other one was stored first. Under
    // PostgreSQL's read committed the second may also see the first's commit before its own
    // insert and fail the status or version check instead of the unique index.
    if (input.clientRef && (isUniqueViolation(err) || err instanceof AppError)) {
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

/**
 * A sharpening done: the machine's hour meter takes the reading (never backwards) and its last
 * sharpening is set to it, so its blades count from zero again; the reading and the last
 * sharpening before are kept on the order, so a reopening can put them back.
 */
async function recordSharpening(ctx: Ctx, tx: Queryable, order: OrderRow, reading: number | undefined): Promise<OrderRow> {
  if (order.equipmentId === null) return order;
  const cols = { id: equipment.id, name: equipment.name, hourMeterH: equipment.hourMeterH, lastSharpenedAtH: equipment.lastSharpenedAtH, version: equipment.version };
  const [before] = await tx.select(cols).from(equipment).where(eq(equipment.id, order.equipmentId));
  if (!before) return order;
  const at = reading ?? before.hourMeterH;
  if (at < before.hourMeterH) {
    throw errors.invalid(`The hour meter of ${before.name} already reads ${before.hourMeterH} h; enter the reading now (${before.hourMeterH} h or more)`, [{ path: 'body.hourMeterH', message: `the meter already reads ${before.hourMeterH} h` }]);
  }
  const [after] = await tx
    .update(equipment)
    .set({ hourMeterH: at, lastSharpenedAtH: at, version: sql`${equipment.version} + 1`, updatedAt: new Date() })
    .where(eq(equipment.id, before.id))
    .returning(cols);
  await writeAudit(tx, { actorId: ctx.actor.id, action: 'update', entity: 'equipment', entityId: before.id, districtId: order.districtId, before, after: after ?? null });
  const details = { ...order.details, sharpenedAtH: at, previousSharpenedAtH: before.lastSharpenedAtH };
  await tx.update(workOrders).set({ details }).where(eq(workOrders.id, order.id));
  return { ...order, details };
}

/** Reopening a sharpening puts the machine's last sharpening back to what it was (the meter reading stays: it was read). */
async function undoSharpening(ctx: Ctx, tx: Queryable, order: OrderRow) {
  if (order.equipmentId === null || typeof order.details.sharpenedAtH !== 'number') return;
  const previous = typeof order.details.previousSharpenedAtH === 'number' ? order.details.previousSharpenedAtH : null;
  const cols = { id: equipment.id, name: equipment.name, lastSharpenedAtH: equipment.lastSharpenedAtH, version: equipment.version };
  const [before] = await tx.select(cols).from(equipment).where(eq(equipment.id, order.equipmentId));
  // A later sharpening recorded since stays.
  if (!before || before.lastSharpenedAtH !== order.details.sharpenedAtH) return;
  const [after] = await tx.update(equipment).set({ lastSharpenedAtH: previous, version: sql`${equipment.version} + 1`, updatedAt: new Date() }).where(eq(equipment.id, before.id)).returning(cols);
  await writeAudit(tx, { actorId: ctx.actor.id, action: 'update', entity: 'equipment', entityId: before.id, districtId: order.districtId, before, after: after ?? null });
}

/** The open state a reopened order returns to: started if the crew had started it, else assigned or planned. */
function openStatus(order: OrderRow): 'started' | 'assigned' | 'planned' {
  return order.startedAt ? 'started' : order.crewId ? 'assigned' : 'planned';
}

/**
 * Reopens a finished (done or skipped) order. The crew lead may undo a mistaken tap on the
 * department's day it was reported; the foreman (or an administrator) may reopen at any time.
 * The earlier report stays in the order's reports and the audit log; the reopening is one more
 * report with its reason. Undoing a done report takes its hours back off the mower's meter.
 */
export async function reopenWork(ctx: Ctx, id: number, input: ReopenInput): Promise<ReopenAnswer<Date>> {
  const first = await orderFor(ctx, id, 'read');
  const foreman = can(ctx, 'update', 'WorkOrder', first);
  if (!foreman) authorize(ctx, 'log', 'WorkOrder', first);
  return (ctx.db as Db).transaction(async (tx) => {
    const before = (await orderRow(tx, id))!;
    if (input.version !== undefined && input.version !== before.version) throw errors.versionConflict('work_order');
    if (before.status !== 'done' && before.status !== 'skipped') {
      throw appError('work_report/not_finished', `This work order is ${before.status}, not done or skipped; there is nothing to reopen`, { status: before.status });
    }
    if (!foreman) {
      const [last] = await tx.select({ reportedAt: workUpdates.reportedAt }).from(workUpdates).where(eq(workUpdates.workOrderId, id)).orderBy(desc(workUpdates.reportedAt), desc(workUpdates.id)).limit(1);
      const finishedAt = before.doneAt ?? last?.reportedAt ?? null;
      if (!finishedAt || ctx.clock.dateOf(finishedAt) !== ctx.clock.today()) {
        throw errors.forbidden('A crew lead can reopen a job only on the day it was reported; ask your foreman to reopen it');
      }
    }
    const status = openStatus(before);
    const now = ctx.clock.now();
    const note = `Reopened (was ${before.status})${input.reason ? `: ${input.reason}` : ''}`;
    const [update] = await tx
      .insert(workUpdates)
      .values({ workOrderId: id, status, actualHours: null, note, clientRef: null, reportedAt: now, createdBy: ctx.actor.id })
      .returning(updateColumns);
    const [bumped] = await tx
      .update(workOrders)
      .set({ status, actualHours: null, doneAt: null, doneBy: null, pinned: true, updatedAt: new Date(), version: sql`${workOrders.version} + 1` })
      .where(and(eq(workOrders.id, id), eq(workOrders.version, before.version)))
      .returning({ id: workOrders.id });
    if (!bumped) throw errors.versionConflict('work_order');
    const after = (await orderRow(tx, id))!;
    await writeAudit(tx, [
      { actorId: ctx.actor.id, action: 'create', entity: 'work_update', entityId: update!.id, districtId: after.districtId, before: null, after: { workOrderId: id, ...update!, reopened: true } },
      { actorId: ctx.actor.id, action: 'update', entity: 'work_order', entityId: id, districtId: after.districtId, before, after },
    ]);
    if (before.status === 'done' && before.task === 'sharpen_blades') await undoSharpening(ctx, tx, before);
    else if (before.status === 'done' && before.equipmentId != null && before.actualHours) {
      await addMeterHours(ctx, tx, before.equipmentId, -before.actualHours, after.districtId);
    }
    return { order: after, update: update! };
  });
}
