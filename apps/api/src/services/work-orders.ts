/**
 * Work orders: reading them as each role may, a foreman's hand changes (add, assign, move,
 * re-time, delete) with optimistic versions, and the e-mail to the crew lead when work is
 * assigned or moved.
 */
import { and, asc, eq, gte, inArray, lte, sql, type SQL } from 'drizzle-orm';
import {
  type CrewMailReport,
  type FieldStatus,
  appError,
  errors,
  mondayOf,
  type CreateWorkOrderInput,
  type UpdateWorkOrderInput,
  type WorkOrderRow as WorkOrderAnswerRow,
  type WorkOrderWriteAnswer,
} from '@swardwise/domain';
import type { PgSelect } from 'drizzle-orm/pg-core';
import type { Db, Queryable } from '../db/client.ts';
import { crews, districts, equipment, fields, sites, users, workOrders, workPhotos } from '../db/schema/index.ts';
import type { Mailer } from '../mail/mailer.ts';
import { workMovedMail } from '../mail/messages.ts';
import { writeAudit } from './audit.ts';
import { authorize, can, type Ctx } from './context.ts';

export interface WorkOrderFilter {
  from: string;
  to: string;
  crewId?: number | undefined;
  districtId?: number | undefined;
}

/** The columns of a work order as lists and the board show it (joined with its field, site, crew and equipment). */
export const workOrderColumns = {
  id: workOrders.id,
  fieldId: workOrders.fieldId,
  // A yard job (no field) reads as the district's yard: no field name, the yard's name and place.
  fieldName: sql<string>`coalesce(${fields.name}, '')`,
  siteId: workOrders.siteId,
  siteName: sql<string>`coalesce(${sites.name}, ${districts.yardName})`,
  siteAddress: sql<string>`coalesce(${sites.address}, '')`,
  fieldStatus: sql<FieldStatus>`coalesce(${fields.status}, 'open')`,
  fieldStatusNote: sql<string>`coalesce(${fields.statusNote}, '')`,
  siteLat: sql<number>`coalesce(${sites.lat}, ${districts.yardLat})`,
  siteLng: sql<number>`coalesce(${sites.lng}, ${districts.yardLng})`,
  districtId: workOrders.districtId,
  task: workOrders.task,
  weekStart: workOrders.weekStart,
  plannedDate: workOrders.plannedDate,
  crewId: workOrders.crewId,
  crewName: sql<string | null>`${crews.name}`,
  equipmentId: workOrders.equipmentId,
  equipmentName: sql<string | null>`${equipment.name}`,
  plannedHours: workOrders.plannedHours,
  actualHours: workOrders.actualHours,
  status: workOrders.status,
  origin: workOrders.origin,
  pinned: workOrders.pinned,
  reason: workOrders.reason,
  notes: workOrders.notes,
  details: workOrders.details,
  doneAt: workOrders.doneAt,
  version: workOrders.version,
  photoCount: sql<number>`(select count(*)::int from ${workPhotos} where ${workPhotos.workOrderId} = ${workOrders.id})`,
  // The centre of the outline's bounding box: inside any field shape a crew drives to; the yard for a yard job.
  fieldLat: sql<number>`coalesce((select (min((p->>1)::float8) + max((p->>1)::float8)) / 2 from jsonb_array_elements(${fields.geometry}->'coordinates'->0) p), ${districts.yardLat})`,
  fieldLng: sql<number>`coalesce((select (min((p->>0)::float8) + max((p->>0)::float8)) / 2 from jsonb_array_elements(${fields.geometry}->'coordinates'->0) p), ${districts.yardLng})`,
};

export type WorkOrderRow = Awaited<ReturnType<typeof selectRows>>[number];

/**
 * Work orders joined with their field, site, district, crew and equipment, as
 * `workOrderColumns` reads them; the caller filters and orders.
 */
export function selectWorkOrders(db: Queryable) {
  return workOrderJoins(db.select(workOrderColumns).from(workOrders).$dynamic());
}

/** A select (`$dynamic()`) of work orders joined as `selectWorkOrders` is. Field and site are left joins: a yard job has neither. */
export function workOrderJoins<Q extends PgSelect>(query: Q) {
  return query
    .leftJoin(fields, eq(fields.id, workOrders.fieldId))
    .leftJoin(sites, eq(sites.id, workOrders.siteId))
    .innerJoin(districts, eq(districts.id, workOrders.districtId))
    .leftJoin(crews, eq(crews.id, workOrders.crewId))
    .leftJoin(equipment, eq(equipment.id, workOrders.equipmentId));
}

async function selectRows(db: Queryable, where: SQL | undefined) {
  return selectWorkOrders(db)
    .where(where)
    .orderBy(asc(workOrders.plannedDate), sql`${sites.name} nulls first`, sql`${fields.name} nulls first`, asc(workOrders.id));
}

/** SQL conditions that keep a list inside what the actor may read. */
export function readScope(ctx: Ctx): SQL | undefined {
  const a = ctx.actor;
  if (a.role === 'foreman') return eq(workOrders.districtId, a.districtId ?? -1);
  if (a.role === 'crew') return eq(workOrders.crewId, a.crewId ?? -1);
  if (a.role === 'partner') return a.siteIds.length ? inArray(workOrders.siteId, a.siteIds) : sql`false`;
  return undefined;
}

export async function listWorkOrders(ctx: Ctx, filter: WorkOrderFilter): Promise<WorkOrderAnswerRow<Date>[]> {
  authorize(ctx, 'read', 'WorkOrder');
  const conditions: (SQL | undefined)[] = [gte(workOrders.plannedDate, filter.from), lte(workOrders.plannedDate, filter.to), readScope(ctx)];
  if (filter.crewId) conditions.push(eq(workOrders.crewId, filter.crewId));
  if (filter.districtId) conditions.push(eq(workOrders.districtId, filter.districtId));
  const rows = await selectRows(ctx.db, and(...conditions));
  return rows.filter((r) => can(ctx, 'read', 'WorkOrder', r));
}

export async function workOrderRows(db: Queryable, ids: number[]): Promise<WorkOrderRow[]> {
  return ids.length ? selectRows(db, inArray(workOrders.id, ids)) : [];
}

async function workOrderRow(db: Queryable, id: number): Promise<WorkOrderRow | undefined> {
  return (await selectRows(db, eq(workOrders.id, id)))[0];
}

/** The crew lead accounts of a crew that can receive e-mail. */
async function crewLeads(db: Queryable, crewId: number) {
  return db.select({ email: users.email, name: users.name }).from(users).where(and(eq(users.crewId, crewId), eq(users.role, 'crew'), eq(users.active, true)));
}

export interface WorkMoveNotice {
  crewId: number;
  kind: 'assigned' | 'moved' | 'removed';
  orders: Array<Pick<WorkOrderRow, 'task' | 'fieldName' | 'siteName' | 'plannedDate' | 'plannedHours'> & { fromDate?: string | null }>;
}

/**
 * Tells each crew lead about work assigned to, moved within or taken from the crew. A mail
 * failure is logged by the mailer and never undoes the change.
 */
export async function notifyCrews(db: Queryable, mailer: Mailer, notices: readonly WorkMoveNotice[], byName: string, portalUrl: string): Promise<number> {
  return (await notifyCrewsReport(db, mailer, notices, byName, portalUrl)).sent;
}

/** As `notifyCrews`, with why a crew got no e-mail: mail off, no crew-lead account, a refused send. */
export async function notifyCrewsReport(db: Queryable, mailer: Mailer, notices: readonly WorkMoveNotice[], byName: string, portalUrl: string): Promise<CrewMailReport> {
  const report: CrewMailReport = { crews: 0, sent: 0, mailOff: !mailer.enabled, crewsWithoutLead: [], failed: 0 };
  for (const n of notices) {
    if (n.orders.length === 0) continue;
    report.crews++;
    const [crew] = await db.select({ name: crews.name }).from(crews).where(eq(crews.id, n.crewId));
    const leads = await crewLeads(db, n.crewId);
    if (leads.length === 0) report.crewsWithoutLead.push(crew?.name ?? `crew ${n.crewId}`);
    for (const lead of leads) {
      // With mail off the mailer only logs what it would have sent.
      if (await mailer.send(workMovedMail(lead.email, lead.name, crew?.name ?? 'your crew', n, byName, portalUrl))) report.sent++;
      else if (mailer.enabled) report.failed++;
    }
  }
  return report;
}

async function fieldScopeRow(db: Queryable, fieldId: number) {
  const [f] = await db.select({ id: fields.id, siteId: fields.siteId, districtId: sites.districtId }).from(fields).innerJoin(sites, eq(sites.id, fields.siteId)).where(eq(fields.id, fieldId));
  return f;
}

/** A crew and a unit must belong to the order's district. */
async function checkCrewAndEquipment(db: Queryable, districtId: number, crewId: number | null | undefined, equipmentId: number | null | undefined) {
  const issues: { path: string; message: string }[] = [];
  if (crewId) {
    const [c] = await db.select({ districtId: crews.districtId }).from(crews).where(eq(crews.id, crewId));
    if (!c) issues.push({ path: 'body.crewId', message: 'no such crew' });
    else if (c.districtId !== districtId) issues.push({ path: 'body.crewId', message: 'this crew works in another district' });
  }
  if (equipmentId) {
    const [e] = await db.select({ districtId: equipment.districtId, active: equipment.active }).from(equipment).where(eq(equipment.id, equipmentId));
    if (!e) issues.push({ path: 'body.equipmentId', message: 'no such equipment' });
    else if (e.districtId !== districtId) issues.push({ path: 'body.equipmentId', message: 'this unit belongs to another district' });
    else if (!e.active) issues.push({ path: 'body.equipmentId', message: 'this unit is out of service' });
  }
  if (issues.length) throw errors.invalid(issues.map((i) => i.message).join('; '), issues);
}

/** Where the crew lead's e-mail goes out and where the portal lives (the writer's name is `ctx.actorName`). */
export interface WriteDeps {
  mailer: Mailer;
  publicUrl: string;
}

/** A foreman adds work by hand (aeration, topdressing, an extra mowing). Kept by every re-generation. */
export async function createWorkOrder(ctx: Ctx, input: CreateWorkOrderInput, deps: WriteDeps): Promise<WorkOrderWriteAnswer<Date>> {
  const f = await fieldScopeRow(ctx.db, input.fieldId);
  if (!f) throw errors.noSuch('field', 'body.fieldId');
  authorize(ctx, 'create', 'WorkOrder', { districtId: f.districtId, siteId: f.siteId });
  // Sharpening is yard work the week plan puts on the board from the hour meters, never work on a field.
  if (input.task === 'sharpen_blades') throw errors.invalid('Blade sharpening is yard work: the week plan adds it when a mower is due', [{ path: 'body.task', message: 'blade sharpening is not work on a field' }]);
  const id = await (ctx.db as Db).transaction(async (tx) => {
    await checkCrewAndEquipment(tx, f.districtId, input.crewId, input.equipmentId);
    const [row] = await tx
      .insert(workOrders)
      .values({
        fieldId: f.id,
        siteId: f.siteId,
        districtId: f.districtId,
        task: input.task,
        weekStart: mondayOf(input.plannedDate),
        plannedDate: input.plannedDate,
        crewId: input.crewId,
        equipmentId: input.equipmentId,
        plannedHours: input.plannedHours,
        status: input.crewId ? 'assigned' : 'planned',
        origin: 'manual',
        pinned: true,
        reason: 'Added by hand',
        notes: input.notes,
        ...(input.colourant ? { details: { colourant: input.colourant } } : {}),
        createdBy: ctx.actor.id,
      })
      .returning();
    await writeAudit(tx, { actorId: ctx.actor.id, action: 'create', entity: 'work_order', entityId: row!.id, districtId: f.districtId, before: null, after: row! });
    return row!.id;
  });
  const row = (await workOrderRow(ctx.db, id))!;
  const emailed = row.crewId ? await notifyCrews(ctx.db, deps.mailer, [{ crewId: row.crewId, kind: 'assigned', orders: [row] }], ctx.actorName, deps.publicUrl) : 0;
  return { ...row, emailed };
}

/** One stored order, for the check of who may write it before its body is read. */
export async function storedWorkOrder(db: Ctx['db'], id: number) {
  return (await db.select().from(workOrders).where(eq(workOrders.id, id)))[0];
}

/**
 * Assign, move or re-time one order. The version must be the one the caller read (two
 * foremen on one order: the second gets a 409). Any change pins the order, so re-generating
 * the week keeps it; giving it a crew makes it assigned. Logged work cannot be moved.
 */
export async function updateWorkOrder(ctx: Ctx, id: number, input: UpdateWorkOrderInput, deps: WriteDeps): Promise<WorkOrderWriteAnswer<Date>> {
  const result = await (ctx.db as Db).transaction(async (tx) => {
    const [before] = await tx.select().from(workOrders).where(eq(workOrders.id, id));
    if (!before) throw errors.notFound('work_order', id);
    authorize(ctx, 'update', 'WorkOrder', before);
    const { version, ...changes } = input;
    if (before.version !== version) throw errors.versionConflict('work_order');
    if ((before.status === 'done' || before.status === 'skipped') && (changes.plannedDate !== undefined || changes.crewId !== undefined)) {
      throw appError('work_order/logged', `This work order is already ${before.status}; it can no longer be moved or reassigned`);
    }
    if (before.fieldId === null && changes.equipmentId !== undefined && changes.equipmentId !== before.equipmentId) {
      throw errors.invalid('A yard job is about its machine: it cannot be moved to another one', [{ path: 'body.equipmentId', message: 'a yard job keeps its machine' }]);
    }
    await checkCrewAndEquipment(tx, before.districtId, changes.crewId, changes.equipmentId);
    const crewId = changes.crewId === undefined ? before.crewId : changes.crewId;
    let status = before.status;
    if (status === 'planned' && crewId) status = 'assigned';
    if (status === 'assigned' && !crewId) status = 'planned';
    const plannedDate = changes.plannedDate ?? before.plannedDate;
    const [after] = await tx
      .update(workOrders)
      .set({
        ...changes,
        status,
        weekStart: mondayOf(plannedDate),
        pinned: changes.pinned ?? true,
        version: sql`${workOrders.version} + 1`,
        updatedAt: new Date(),
      })
      .where(and(eq(workOrders.id, id), eq(workOrders.version, version)))
      .returning();
    if (!after) throw errors.versionConflict('work_order');
    await writeAudit(tx, { actorId: ctx.actor.id, action: 'update', entity: 'work_order', entityId: id, districtId: after.districtId, before, after });
    return { before, after };
  });
  const row = (await workOrderRow(ctx.db, id))!;
  const { before, after } = result;
  const notices: WorkMoveNotice[] = [];
  if (after.crewId !== before.crewId) {
    if (after.crewId) notices.push({ crewId: after.crewId, kind: 'assigned', orders: [row] });
    if (before.crewId) notices.push({ crewId: before.crewId, kind: 'removed', orders: [{ ...row, plannedDate: before.plannedDate }] });
  } else if (after.crewId && after.plannedDate !== before.plannedDate) {
    notices.push({ crewId: after.crewId, kind: 'moved', orders: [{ ...row, fromDate: before.plannedDate }] });
  }
  const emailed = await notifyCrews(ctx.db, deps.mailer, notices, ctx.actorName, deps.publicUrl);
  return { ...row, emailed };
}

export async function deleteWorkOrder(ctx: Ctx, id: number, version: number, deps: WriteDeps): Promise<void> {
  const before = await (ctx.db as Db).transaction(async (tx) => {
    const [row] = await tx.select().from(workOrders).where(eq(workOrders.id, id));
    if (!row) throw errors.notFound('work_order', id);
    authorize(ctx, 'delete', 'WorkOrder', row);
    if (row.status === 'done' || row.status === 'started') throw appError('work_order/logged', `This work order is ${row.status}: it is part of the records and cannot be deleted`);
    const [deleted] = await tx.delete(workOrders).where(and(eq(workOrders.id, id), eq(workOrders.version, version))).returning({ id: workOrders.id });
    if (!deleted) throw errors.versionConflict('work_order');
    await writeAudit(tx, { actorId: ctx.actor.id, action: 'delete', entity: 'work_order', entityId: id, districtId: row.districtId, before: row, after: null });
    return row;
  });
  if (before.crewId && before.status === 'assigned') {
    const [f] = before.fieldId === null ? [] : await ctx.db.select({ fieldName: fields.name, siteName: sites.name }).from(fields).innerJoin(sites, eq(sites.id, fields.siteId)).where(eq(fields.id, before.fieldId));
    await notifyCrews(ctx.db, deps.mailer, [{ crewId: before.crewId, kind: 'removed', orders: [{ task: before.task, fieldName: f?.fieldName ?? '', siteName: f?.siteName ?? '', plannedDate: before.plannedDate, plannedHours: before.plannedHours }] }], ctx.actorName, deps.publicUrl);
  }
}
