/**
 * The district's week plan: generated from the turf engine and the weather, kept by hand,
 * shown as a board of crews × days with each crew-day's load and route.
 */
import { and, asc, desc, eq, gte, inArray, lte, max, ne, sql } from 'drizzle-orm';
import {
  AppError,
  addDaysIso,
  assignWeek,
  crewDayLoads,
  isKept,
  planFieldWeek,
  reconcileWeek,
  weekDates,
  MOWER_KINDS,
  type AskedOrder,
  type ConfirmAnswer,
  type DiffItem,
  type GenerateAnswer,
  type GenerateWeekInput,
  type Level,
  type PlanEquipment,
  type PlanField,
  type PlanMower,
  type ScheduledOrder,
  type WeekBoard,
  type WeekQuery,
  type WorkTask,
  type Weekday,
} from '@swardwise/domain';
import type { Db, Queryable } from '../db/client.ts';
import { auditLog, crews, districts, equipment, fieldChecks, fieldEvents, fields, sites, users, workOrders } from '../db/schema/index.ts';
import { authorize, type Ctx } from './context.ts';
import { loadParameters, loadStandards } from './standards.ts';
import { planningWeather } from './stations.ts';
import { notifyCrews, readScope, workOrderRows, type WorkMoveNotice, type WorkOrderRow, type WriteDeps } from './work-orders.ts';

async function districtRow(db: Queryable, id: number) {
  const [d] = await db.select({ id: districts.id, name: districts.name, yardName: districts.yardName, yardLat: districts.yardLat, yardLng: districts.yardLng }).from(districts).where(eq(districts.id, id));
  if (!d) throw new AppError('not_found', 'district/not_found', `No district with id ${id}`);
  return d;
}

async function districtCrews(db: Queryable, districtId: number) {
  return db
    .select({
      id: crews.id,
      name: crews.name,
      hoursPerDay: crews.hoursPerDay,
      workDays: crews.workDays,
      leadName: sql<string | null>`(select ${users.name} from ${users} where ${users.crewId} = ${crews.id} and ${users.role} = 'crew' and ${users.active} order by ${users.id} limit 1)`,
    })
    .from(crews)
    .where(eq(crews.districtId, districtId))
    .orderBy(asc(crews.name), asc(crews.id));
}

/** Last date each field had each task done (from the records). */
async function lastDone(db: Queryable, fieldIds: number[]) {
  const out = new Map<string, string>();
  if (fieldIds.length === 0) return out;
  const rows = await db
    .select({ fieldId: workOrders.fieldId, task: workOrders.task, last: max(workOrders.plannedDate) })
    .from(workOrders)
    .where(and(inArray(workOrders.fieldId, fieldIds), eq(workOrders.status, 'done')))
    .groupBy(workOrders.fieldId, workOrders.task);
  for (const r of rows) if (r.last) out.set(`${r.fieldId}|${r.task}`, r.last);
  const checks = await db.select({ fieldId: fieldChecks.fieldId, last: max(fieldChecks.checkedOn) }).from(fieldChecks).where(inArray(fieldChecks.fieldId, fieldIds)).groupBy(fieldChecks.fieldId);
  for (const c of checks) {
    const key = `${c.fieldId}|field_check`;
    if (c.last && (!out.has(key) || out.get(key)! < c.last)) out.set(key, c.last);
  }
  return out;
}

interface GenerationInput {
  districtId: number;
  weekStart: string;
}

/** Everything the engine needs for a district's week, read in a few queries. */
async function planDistrictWeek(db: Queryable, q: GenerationInput, existing: ExistingRow[], today: string) {
  const dates = weekDates(q.weekStart);
  const weekEnd = dates[6]!;
  // In the week under way, work goes on today (the department's) or later.
  const notBefore = today > q.weekStart && today <= weekEnd ? today : undefined;
  const district = await districtRow(db, q.districtId);
  const { standards } = await loadStandards(db);
  const params = await loadParameters(db);
  const crewRows = await districtCrews(db, q.districtId);
  const fieldRows = await db
    .select({
      id: fields.id,
      name: fields.name,
      siteId: fields.siteId,
      siteLat: sites.lat,
      siteLng: sites.lng,
      sport: fields.sport,
      grass: fields.grass,
      areaM2: fields.areaM2,
      geometry: fields.geometry,
      maintenanceLevel: fields.maintenanceLevel,
      hocOverrideMm: fields.hocOverrideMm,
      clippings: fields.clippings,
      irrigation: fields.irrigation,
      status: fields.status,
      lastMowedOn: fields.lastMowedOn,
    })
    .from(fields)
    .innerJoin(sites, eq(sites.id, fields.siteId))
    // Retired fields are not kept any more: the week asks nothing of them.
    .where(and(eq(sites.districtId, q.districtId), ne(fields.status, 'retired')))
    .orderBy(asc(fields.id));
  const fieldIds = fieldRows.map((f) => f.id);
  const done = await lastDone(db, fieldIds);
  const events = await db
    .select({ id: fieldEvents.id, fieldId: fieldEvents.fieldId, startsOn: fieldEvents.startsOn, title: fieldEvents.title })
    .from(fieldEvents)
    .where(and(eq(fieldEvents.districtId, q.districtId), gte(fieldEvents.startsOn, q.weekStart), lte(fieldEvents.startsOn, addDaysIso(q.weekStart, 7))));
  const eventsOf = new Map<number, { id: number; startsOn: string; title: string }[]>();
  for (const e of events) eventsOf.set(e.fieldId, [...(eventsOf.get(e.fieldId) ?? []), e]);
  const units = await db.select().from(equipment).where(and(eq(equipment.districtId, q.districtId), eq(equipment.active, true))).orderBy(asc(equipment.id));
  const mowers: PlanMower[] = units.flatMap((u) =>
    MOWER_KINDS.includes(u.kind) && u.cuttingWidthM && u.speedKmh && u.fieldEfficiency && u.hocMinMm !== null && u.hocMaxMm !== null
      ? [{ id: u.id, crewId: u.crewId, kind: u.kind.replace('_mower', '') as PlanMower['kind'], widthM: u.cuttingWidthM, speedKmh: u.speedKmh, efficiency: u.fieldEfficiency, hocMinMm: u.hocMinMm, hocMaxMm: u.hocMaxMm }]
      : [],
  );
  const planEquipment: PlanEquipment[] = units.flatMap((u): PlanEquipment[] => {
    if (MOWER_KINDS.includes(u.kind)) {
      const e: PlanEquipment = { id: u.id, crewId: u.crewId, kind: 'mower', mowerKind: u.kind.replace('_mower', '') as NonNullable<PlanEquipment['mowerKind']> };
      if (u.hocMinMm !== null) e.hocMinMm = u.hocMinMm;
      if (u.hocMaxMm !== null) e.hocMaxMm = u.hocMaxMm;
      return [e];
    }
    if (u.kind === 'line_marker' || u.kind === 'spreader') return [{ id: u.id, crewId: u.crewId, kind: u.kind }];
    return [];
  });

  const workDays = [...new Set(crewRows.flatMap((c) => c.workDays))] as Weekday[];
  const kept = existing.filter(isKept);
  const keptByField = new Map<number, typeof kept>();
  for (const k of kept) keptByField.set(k.fieldId, [...(keptByField.get(k.fieldId) ?? []), k]);
  const weather = await planningWeather(db, addDaysIso(weekEnd, 7));
  const asked: AskedOrder[] = [];
  const notes = new Set<string>();
  let noWeather = 0;
  for (const f of fieldRows) {
    const station = weather.nearest({ lat: f.siteLat, lng: f.siteLng });
    if (!station) {
      noWeather++;
      continue;
    }
    const w = await weather.load(station.id);
    const field: PlanField = {
      id: f.id,
      siteId: f.siteId,
      site: { lat: f.siteLat, lng: f.siteLng },
      sport: f.sport,
      grass: f.grass,
      areaM2: f.areaM2,
      geometry: f.geometry,
      maintenanceLevel: f.maintenanceLevel as Level,
      hocOverrideMm: f.hocOverrideMm,
      clippings: f.clippings,
      irrigation: f.irrigation,
      status: f.status,
      // The later of the field's record and the last mowing logged done.
      lastMowedOn: [f.lastMowedOn, done.get(`${f.id}|mow`) ?? null].filter((d): d is string => d !== null).sort().pop() ?? null,
      lastPaintedOn: done.get(`${f.id}|paint_lines`) ?? null,
      lastFedOn: done.get(`${f.id}|feed`) ?? null,
      lastCheckedOn: done.get(`${f.id}|field_check`) ?? null,
      events: eventsOf.get(f.id) ?? [],
    };
    const plan = planFieldWeek({ field, weather: w, weekStart: q.weekStart, kept: keptByField.get(f.id) ?? [], workDays: workDays.length ? workDays : ['mon', 'tue', 'wed', 'thu', 'fri'], mowers, standards, params, ...(notBefore ? { notBefore } : {}) });
    asked.push(...plan.orders);
    for (const n of plan.notes) if (/projected|No weather/.test(n)) notes.add(n.replace(/^No weather on file before .*?:/, 'Some fields have no weather before the week:'));
  }
  if (noWeather) notes.add(`${noWeather} field(s) have no weather station with data: only their hand-made work is shown. Add weather first.`);

  // Crew hints: the crew that last worked each site in the four weeks before.
  const hintRows = await db
    .select({ siteId: workOrders.siteId, crewId: workOrders.crewId, last: max(workOrders.plannedDate) })
    .from(workOrders)
    .where(and(eq(workOrders.districtId, q.districtId), gte(workOrders.plannedDate, addDaysIso(q.weekStart, -28)), lte(workOrders.plannedDate, weekEnd), sql`${workOrders.crewId} is not null`))
    .groupBy(workOrders.siteId, workOrders.crewId);
  const siteCrewHint = new Map<number, number>();
  const hintDate = new Map<number, string>();
  for (const h of hintRows) {
    if (h.crewId === null || !h.last) continue;
    if (!hintDate.has(h.siteId) || hintDate.get(h.siteId)! < h.last) {
      siteCrewHint.set(h.siteId, h.crewId);
      hintDate.set(h.siteId, h.last);
    }
  }
  const keptHours = new Map<string, number>();
  for (const k of kept) if (k.crewId !== null && k.status !== 'skipped') keptHours.set(`${k.crewId}|${k.plannedDate}`, (keptHours.get(`${k.crewId}|${k.plannedDate}`) ?? 0) + k.plannedHours);
  const siteLocations = new Map(fieldRows.map((f) => [f.siteId, { lat: f.siteLat, lng: f.siteLng }]));
  const assigned = assignWeek({
    weekStart: q.weekStart,
    orders: asked,
    crews: crewRows.map((c) => ({ id: c.id, hoursPerDay: c.hoursPerDay, workDays: c.workDays })),
    keptHours,
    siteCrewHint,
    equipment: planEquipment,
    sites: siteLocations,
    yard: { lat: district.yardLat, lng: district.yardLng },
    travel: params.travel,
    ...(notBefore ? { notBefore } : {}),
  });
  const fieldNames = new Map(fieldRows.map((f) => [f.id, f.name]));
  return { orders: assigned.orders, warnings: [...notes, ...assigned.warnings.map((w) => w.replace(/field (\d+)/, (_, id: string) => fieldNames.get(Number(id)) ?? `field ${id}`))], crewRows, fieldCount: fieldRows.length };
}

type ExistingRow = typeof workOrders.$inferSelect;

async function weekRows(db: Queryable, districtId: number, weekStart: string) {
  return db
    .select()
    .from(workOrders)
    .where(and(eq(workOrders.districtId, districtId), gte(workOrders.plannedDate, weekStart), lte(workOrders.plannedDate, addDaysIso(weekStart, 6))))
    .orderBy(asc(workOrders.id));
}

/** The board of a district's week: orders, crews, each crew-day's load and route. */
export async function getWeekBoard(ctx: Ctx, q: WeekQuery): Promise<WeekBoard<Date>> {
  authorize(ctx, 'read', 'WorkOrder', { districtId: q.districtId });
  if (ctx.actor.role === 'crew' || ctx.actor.role === 'partner') throw new AppError('forbidden', 'auth/forbidden', 'The week plan board is for foremen and the department');
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
  const sitesMap = new Map(rows.map((r) => [r.siteId, { lat: r.siteLat, lng: r.siteLng }]));
  const siteNames = new Map(rows.map((r) => [r.siteId, r.siteName]));
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

async function boardRows(db: Queryable, ids: number[]): Promise<WorkOrderRow[]> {
  const out: WorkOrderRow[] = [];
  // One query per chunk keeps the statement small for very large weeks.
  for (let i = 0; i < ids.length; i += 2000) out.push(...(await workOrderRows(db, ids.slice(i, i + 2000))));
  return out;
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
  const plan = await planDistrictWeek(ctx.db, q, existing, ctx.clock.today());
  const rec = reconcileWeek(existing, plan.orders);

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
  const diff = {
    added: rec.insert.map(item),
    removed: rec.remove.map(item),
    changed: rec.update.map((u) => ({ before: item(u.before), after: item(u.next), what: u.what })),
    kept: rec.kept.map(item),
    summary: { added: rec.insert.length, removed: rec.remove.length, changed: rec.update.length, kept: rec.kept.length, unchanged: rec.unchanged.length },
  };

  if (!input.dryRun) {
    await (ctx.db as Db).transaction(async (tx) => {
      const audits: (typeof auditLog.$inferInsert)[] = [];
      if (rec.remove.length) {
        const gone = await tx
          .delete(workOrders)
          .where(and(inArray(workOrders.id, rec.remove.map((r) => r.id)), eq(workOrders.pinned, false), eq(workOrders.origin, 'generated'), inArray(workOrders.status, ['planned', 'assigned'])))
          .returning({ id: workOrders.id });
        if (gone.length !== rec.remove.length) throw stale();
        for (const r of rec.remove) audits.push({ actorId: ctx.actor.id, action: 'delete', entity: 'work_order', entityId: r.id, districtId: r.districtId, before: r, after: null });
      }
      for (const u of rec.update) {
        const p = u.next;
        const [after] = await tx
          .update(workOrders)
          .set({ plannedDate: p.plannedDate, weekStart: q.weekStart, plannedHours: p.plannedHours, crewId: p.crewId, equipmentId: p.equipmentId, reason: p.reason, details: { ...p.details, dueBy: p.latestDate }, status: 'planned', version: sql`${workOrders.version} + 1`, updatedAt: new Date() })
          .where(and(eq(workOrders.id, u.id), eq(workOrders.version, u.before.version), eq(workOrders.pinned, false)))
          .returning();
        if (!after) throw stale();
        audits.push({ actorId: ctx.actor.id, action: 'update', entity: 'work_order', entityId: u.id, districtId: after.districtId, before: u.before, after });
      }
      // Unchanged orders take the newest reasons and details (heights, run times) without a new version.
      const planned = new Map(plan.orders.map((o) => [`${o.fieldId}|${o.task}|${o.plannedDate}`, o]));
      for (const u of rec.unchanged) {
        const p = planned.get(`${u.fieldId}|${u.task}|${u.plannedDate}`);
        const details = p ? { ...p.details, dueBy: p.latestDate } : null;
        if (p && (p.reason !== u.reason || canonical(details) !== canonical(u.details))) await tx.update(workOrders).set({ reason: p.reason, details: details! }).where(eq(workOrders.id, u.id));
      }
      if (rec.insert.length) {
        const rows = rec.insert.map((p) => toInsert(p, q, ctx.actor.id));
        const ids = await bulkInsertOrders(tx, rows);
        // The audit keeps what was planned (the engine's details stay on the order row).
        rows.forEach((r, k) => {
          const { details: _details, ...after } = r;
          audits.push({ actorId: ctx.actor.id, action: 'create', entity: 'work_order', entityId: ids[k]!, districtId: q.districtId, before: null, after: { id: ids[k]!, ...after } });
        });
      }
      audits.push({ actorId: ctx.actor.id, action: 'create', entity: 'week_plan', entityId: null, districtId: q.districtId, before: null, after: { weekStart: q.weekStart, ...diff.summary, warnings: plan.warnings } });
      await bulkInsertAudit(tx, audits);
    });
  }
  const board = await getWeekBoard(ctx, q);
  return { dryRun: input.dryRun, diff, warnings: plan.warnings, board };
}

/** JSON with keys sorted: jsonb does not keep key order, so plain JSON.stringify would differ. */
function canonical(v: unknown): string {
  if (Array.isArray(v)) return `[${v.map(canonical).join(',')}]`;
  if (v && typeof v === 'object') {
    return `{${Object.keys(v as object)
      .filter((k) => (v as Record<string, unknown>)[k] !== undefined)
      .sort()
      .map((k) => `${JSON.stringify(k)}:${canonical((v as Record<string, unknown>)[k])}`)
      .join(',')}}`;
  }
  return JSON.stringify(v);
}

const stale = () => new AppError('conflict', 'week_plan/changed', 'The week changed while it was being generated (someone assigned or moved work); generate again to see the current plan');

/**
 * Many orders in one statement: the rows travel as one JSON parameter (json_to_recordset),
 * which PGlite and PostgreSQL take far faster than thousands of bound parameters. Ids come
 * back in input order (WITH ORDINALITY).
 */
async function bulkInsertOrders(tx: Queryable, rows: (typeof workOrders.$inferInsert)[]): Promise<number[]> {
  const json = JSON.stringify(rows.map((r, i) => ({ n: i, ...r })));
  const res = await tx.execute<{ id: number; n: number }>(sql`
    with input as (
      select * from json_to_recordset(${json}::json) as x(
        n int, "fieldId" int, "siteId" int, "districtId" int, task text, "weekStart" date, "plannedDate" date,
        "crewId" int, "equipmentId" int, "plannedHours" real, status text, origin text, pinned boolean,
        reason text, details jsonb, "createdBy" int)
    ), inserted as (
      insert into ${workOrders} (field_id, site_id, district_id, task, week_start, planned_date, crew_id, equipment_id, planned_hours, status, origin, pinned, reason, details, created_by)
      select "fieldId", "siteId", "districtId", task, "weekStart", "plannedDate", "crewId", "equipmentId", "plannedHours", status, origin, pinned, reason, details, "createdBy"
      from input order by n
      returning id, field_id, task, planned_date
    )
    select i.id, input.n from inserted i join input on input."fieldId" = i.field_id and input.task = i.task and input."plannedDate" = i.planned_date`);
  const out = new Array<number>(rows.length);
  for (const r of res.rows) out[r.n] = r.id;
  return out;
}

async function bulkInsertAudit(tx: Queryable, rows: (typeof auditLog.$inferInsert)[]): Promise<void> {
  if (!rows.length) return;
  const json = JSON.stringify(rows);
  await tx.execute(sql`
    insert into ${auditLog} (actor_id, action, entity, entity_id, district_id, before, after)
    select "actorId", action, entity, "entityId", "districtId", before, after
    from json_to_recordset(${json}::json) as x("actorId" int, action text, entity text, "entityId" int, "districtId" int, before jsonb, after jsonb)`);
}

function toInsert(p: ScheduledOrder, q: GenerationInput, actorId: number): typeof workOrders.$inferInsert {
  return {
    fieldId: p.fieldId,
    siteId: p.siteId,
    districtId: q.districtId,
    task: p.task,
    weekStart: q.weekStart,
    plannedDate: p.plannedDate,
    crewId: p.crewId,
    equipmentId: p.equipmentId,
    plannedHours: p.plannedHours,
    status: 'planned',
    origin: 'generated',
    pinned: false,
    reason: p.reason,
    details: { ...p.details, dueBy: p.latestDate },
    createdBy: actorId,
  };
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
    for (let i = 0; i < after.length; i += 500) {
      await tx.insert(auditLog).values(after.slice(i, i + 500).map((a) => ({ actorId: ctx.actor.id, action: 'update' as const, entity: 'work_order', entityId: a.id, districtId: a.districtId, before: byId.get(a.id) ?? null, after: a })));
    }
    return after;
  });
  const byCrew = new Map<number, WorkMoveNotice>();
  for (const row of await boardRows(ctx.db, changed.map((a) => a.id))) {
    if (row.crewId === null) continue;
    const n = byCrew.get(row.crewId) ?? { crewId: row.crewId, kind: 'assigned', orders: [] };
    n.orders.push(row);
    byCrew.set(row.crewId, n);
  }
  const emailed = await notifyCrews(ctx.db, deps.mailer, [...byCrew.values()], deps.actorName, deps.publicUrl);
  return { assigned: changed.length, emailed, board: await getWeekBoard(ctx, q) };
}
