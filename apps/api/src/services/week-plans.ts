/**
 * The district's week plan: generated from the turf engine and the weather, kept by hand,
 * shown as a board of crews × days with each crew-day's load and route. Loading, the engine
 * run, the bulk write and the crews' mail live in `week-plans/`.
 */
import { and, desc, eq, gte, inArray, lte, sql } from 'drizzle-orm';
import { errors, crewDayLoads, mondayOf, reconcileWeek, weekDates, type ConfirmAnswer, type DiffItem, type GenerateAnswer, type GenerateWeekInput, type RainOutAnswer, type RainOutInput, type WeekBoard, type WeekQuery, type WorkTask } from '@swardwise/domain';
import type { Db } from '../db/client.ts';
import { auditLog, crews, fields, sites, workOrders } from '../db/schema/index.ts';
import { writeAudit } from './audit.ts';
import { authorize, type Ctx } from './context.ts';
import { loadParameters } from './standards.ts';
import { readScope, type WorkOrderRow, type WriteDeps } from './work-orders.ts';
import { boardRows, districtCrews, districtRow, weekRows, yardWeekRows } from './week-plans/load.ts';
import { reconcileYard } from './week-plans/yard.ts';
import { mailNewWork } from './week-plans/mail.ts';
import { planDistrictWeek } from './week-plans/plan.ts';
import { writeGeneratedWeek } from './week-plans/write.ts';

/** The board of a district's week: orders, crews, each crew-day's load and route. */
export async function getWeekBoard(ctx: Ctx, q: WeekQuery): Promise<WeekBoard<Date>> {
  authorize(ctx, 'read', 'WorkOrder', { districtId: q.districtId });
  if (ctx.actor.role === 'crew' || ctx.actor.role === 'partner') throw errors.forbidden('The week plan board is for foremen and the department');
  const dates = weekDates(q.weekStart);
  const district = await districtRow(ctx.db, q.districtId);
  const params = await loadParameters(ctx.db);
  const crewRows = await districtCrews(ctx.db, q.districtId);
  const orders = (
    await ctx.db
      .select({ id: workOrders.id })
      .from(workOrders)
      .where(and(eq(workOrders.districtId, q.districtId), gte(workOrders.plannedDate, dates[0]!), lte(workOrders.plannedDate, dates[6]!), readScope(ctx)))
  ).map((r) => r.id);
  const rows: WorkOrderRow[] = orders.length ? await boardRows(ctx.db, orders) : [];
  const onSites = rows.filter((r): r is WorkOrderRow & { siteId: number } => r.siteId !== null);
  const sitesMap = new Map(onSites.map((r) => [r.siteId, { lat: r.siteLat, lng: r.siteLng }]));
  const siteNames = new Map(onSites.map((r) => [r.siteId, r.siteName]));
  const yard = { lat: district.yardLat, lng: district.yardLng };
  const loads = crewDayLoads(rows, crewRows, sitesMap, yard, params.travel, q.weekStart).map((l) => ({
    ...l,
    route: l.route.map((siteId) => ({ siteId, siteName: siteNames.get(siteId) ?? '', lat: sitesMap.get(siteId)?.lat ?? 0, lng: sitesMap.get(siteId)?.lng ?? 0 })),
  }));
  const [last] = await ctx.db
    .select({ at: auditLog.at })
    .from(auditLog)
    .where(and(eq(auditLog.entity, 'week_plan'), eq(auditLog.districtId, q.districtId), sql`${auditLog.after}->>'weekStart' = ${q.weekStart}`))
    .orderBy(desc(auditLog.at))
    .limit(1);
  const warnings: string[] = [];
  const dayLabel = (iso: string) => new Date(`${iso}T12:00:00Z`).toLocaleDateString('en-US', { weekday: 'short', day: 'numeric', month: 'short', timeZone: 'UTC' });
  for (const l of loads) {
    if (!l.overloaded) continue;
    const crew = crewRows.find((c) => c.id === l.crewId)?.name ?? 'A crew';
    warnings.push(
      l.availableHours === 0
        ? `${crew} has ${l.totalHours.toFixed(1)} h of work on ${dayLabel(l.date)}, a day it does not work: move it or change the crew's working days.`
        : `${crew} is over its hours on ${dayLabel(l.date)}: ${l.totalHours.toFixed(1)} h planned for ${l.availableHours.toFixed(1)} h available.`,
    );
  }
  const unassigned = rows.filter((r) => r.crewId === null && r.status !== 'skipped');
  if (unassigned.length) warnings.push(`${unassigned.length} work order(s) have no crew yet.`);
  return {
    districtId: district.id,
    districtName: district.name,
    weekStart: q.weekStart,
    dates,
    yard: { name: district.yardName, lat: district.yardLat, lng: district.yardLng },
    crews: crewRows,
    orders: rows,
    crewDays: loads,
    unassignedHours: Math.round(unassigned.reduce((s, r) => s + r.plannedHours, 0) * 100) / 100,
    warnings,
    lastGeneratedAt: last?.at ? new Date(last.at).toISOString() : null,
  };
}

/**
 * Generates (or re-generates) the week. Kept orders (pinned, hand-made, started, done,
 * skipped) stay as they are and count as work in the engine; the rest is matched to the new
 * plan. `dryRun` shows the change and writes nothing. Every insert, update and delete is
 * audited, plus one entry for the run.
 */
export async function generateWeek(ctx: Ctx, input: GenerateWeekInput): Promise<GenerateAnswer<Date>> {
  authorize(ctx, 'create', 'WorkOrder', { districtId: input.districtId });
  const q = { districtId: input.districtId, weekStart: input.weekStart };
  const existing = await weekRows(ctx.db, q.districtId, q.weekStart);
  const yardExisting = await yardWeekRows(ctx.db, q.districtId, q.weekStart);
  const plan = await planDistrictWeek(ctx.db, q, existing, ctx.clock.today(), yardExisting);
  const rec = reconcileWeek(existing, plan.orders);
  const yard = reconcileYard(yardExisting, plan.sharpenJobs);

  const fieldInfo = new Map(
    (await ctx.db.select({ id: fields.id, name: fields.name, siteName: sites.name }).from(fields).innerJoin(sites, eq(sites.id, fields.siteId)).where(eq(sites.districtId, q.districtId))).map((f) => [f.id, f]),
  );
  const crewName = new Map(plan.crewRows.map((c) => [c.id, c.name]));
  const item = (o: { fieldId: number; task: WorkTask; plannedDate: string; plannedHours: number; crewId: number | null; reason: string }): DiffItem => ({
    fieldId: o.fieldId,
    fieldName: fieldInfo.get(o.fieldId)?.name ?? '',
    siteName: fieldInfo.get(o.fieldId)?.siteName ?? '',
    task: o.task,
    plannedDate: o.plannedDate,
    plannedHours: o.plannedHours,
    crewId: o.crewId,
    crewName: o.crewId === null ? null : (crewName.get(o.crewId) ?? null),
    reason: o.reason,
  });
  // A yard job reads as its machine at the district's yard.
  const yardItem = (o: { equipmentId: number | null; plannedDate: string; plannedHours: number; crewId: number | null; reason: string }): DiffItem => ({
    fieldId: null,
    fieldName: (o.equipmentId !== null && plan.machineNames.get(o.equipmentId)) || 'a machine',
    siteName: plan.yardName,
    task: 'sharpen_blades',
    plannedDate: o.plannedDate,
    plannedHours: o.plannedHours,
    crewId: o.crewId,
    crewName: o.crewId === null ? null : (crewName.get(o.crewId) ?? null),
    reason: o.reason,
  });
  const diff = {
    added: [...yard.insert.map(yardItem), ...rec.insert.map(item)],
    removed: [...yard.remove.map(yardItem), ...rec.remove.map(item)],
    changed: [...yard.update.map((u) => ({ before: yardItem(u.before), after: yardItem(u.next), what: u.what })), ...rec.update.map((u) => ({ before: item(u.before), after: item(u.next), what: u.what }))],
    kept: [...yard.kept.map(yardItem), ...rec.kept.map(item)],
    summary: {
      added: rec.insert.length + yard.insert.length,
      removed: rec.remove.length + yard.remove.length,
      changed: rec.update.length + yard.update.length,
      kept: rec.kept.length + yard.kept.length,
      unchanged: rec.unchanged.length + yard.unchanged.length,
    },
  };

  if (!input.dryRun) {
    await writeGeneratedWeek(ctx, q, rec, plan.orders, diff.summary, plan.warnings, yard);
  }
  const board = await getWeekBoard(ctx, q);
  return { dryRun: input.dryRun, diff, warnings: plan.warnings, board };
}

/**
 * Confirms the suggested crews: every planned order of the week that has a crew becomes
 * assigned and pinned, and each crew lead gets one e-mail listing the crew's new work.
 */
export async function confirmWeek(ctx: Ctx, q: WeekQuery & { crewId?: number | undefined }, deps: WriteDeps): Promise<ConfirmAnswer<Date>> {
  authorize(ctx, 'update', 'WorkOrder', { districtId: q.districtId });
  const dates = weekDates(q.weekStart);
  const changed = await (ctx.db as Db).transaction(async (tx) => {
    const conditions = [eq(workOrders.districtId, q.districtId), gte(workOrders.plannedDate, dates[0]!), lte(workOrders.plannedDate, dates[6]!), eq(workOrders.status, 'planned'), sql`${workOrders.crewId} is not null`];
    if (q.crewId) conditions.push(eq(workOrders.crewId, q.crewId));
    const before = await tx.select().from(workOrders).where(and(...conditions));
    if (before.length === 0) return [];
    const after = await tx
      .update(workOrders)
      .set({ status: 'assigned', pinned: true, version: sql`${workOrders.version} + 1`, updatedAt: new Date() })
      .where(inArray(workOrders.id, before.map((b) => b.id)))
      .returning();
    const byId = new Map(before.map((b) => [b.id, b]));
    await writeAudit(tx, after.map((a) => ({ actorId: ctx.actor.id, action: 'update' as const, entity: 'work_order', entityId: a.id, districtId: a.districtId, before: byId.get(a.id) ?? null, after: a })));
    return after;
  });
  const mail = await mailNewWork(ctx.db, changed.map((a) => a.id), deps, ctx.actorName);
  return { assigned: changed.length, emailed: mail.sent, mail, board: await getWeekBoard(ctx, q) };
}

/**
 * A rain-out: the day's open work (planned, assigned or started) of one crew, or of every crew
 * of the district, is cancelled with a reason. Each order becomes skipped and pinned with the
 * reason in its details (the crew's Today shows it), every change is audited, and one
 * `rain_out` entry records the day, so generating the week again puts no work on it and asks
 * the cancelled work again on the next working days.
 */
export async function rainOut(ctx: Ctx, input: RainOutInput): Promise<RainOutAnswer<Date>> {
  authorize(ctx, 'update', 'WorkOrder', { districtId: input.districtId });
  await districtRow(ctx.db, input.districtId);
  if (input.crewId !== null) {
    const [c] = await ctx.db.select({ districtId: crews.districtId }).from(crews).where(eq(crews.id, input.crewId));
    if (!c) throw errors.noSuch('crew', 'body.crewId');
    if (c.districtId !== input.districtId) throw errors.invalid('This crew works in another district', [{ path: 'body.crewId', message: 'this crew works in another district' }]);
  }
  const cancelled = { reason: input.reason, by: ctx.actorName, on: ctx.clock.today() };
  const changed = await (ctx.db as Db).transaction(async (tx) => {
    const conditions = [eq(workOrders.districtId, input.districtId), eq(workOrders.plannedDate, input.date), inArray(workOrders.status, ['planned', 'assigned', 'started'])];
    if (input.crewId !== null) conditions.push(eq(workOrders.crewId, input.crewId));
    const before = await tx.select().from(workOrders).where(and(...conditions));
    const after = before.length
      ? await tx
          .update(workOrders)
          .set({ status: 'skipped', pinned: true, details: sql`${workOrders.details} || ${JSON.stringify({ cancelled })}::jsonb`, version: sql`${workOrders.version} + 1`, updatedAt: new Date() })
          .where(inArray(workOrders.id, before.map((b) => b.id)))
          .returning()
      : [];
    const byId = new Map(before.map((b) => [b.id, b]));
    await writeAudit(tx, [
      ...after.map((a) => ({ actorId: ctx.actor.id, action: 'update' as const, entity: 'work_order', entityId: a.id, districtId: a.districtId, before: byId.get(a.id) ?? null, after: a })),
      { actorId: ctx.actor.id, action: 'create' as const, entity: 'rain_out', entityId: null, districtId: input.districtId, before: null, after: { date: input.date, crewId: input.crewId, reason: input.reason, orderIds: after.map((a) => a.id) } },
    ]);
    return after;
  });
  return { cancelled: changed.length, board: await getWeekBoard(ctx, { districtId: input.districtId, weekStart: mondayOf(input.date) }) };
}
