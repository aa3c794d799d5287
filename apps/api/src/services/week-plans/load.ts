/** What a district's week is planned from, read in a few queries. */
import { and, asc, desc, eq, gte, inArray, isNotNull, isNull, lt, lte, max, ne, sql } from 'drizzle-orm';
import { errors, addDaysIso, CULTURAL_TASKS, MOWER_KINDS, type CulturalTask, type Level, type PlanEquipment, type PlanField, type PlanMower, type SharpenMachine } from '@swardwise/domain';
import type { Queryable } from '../../db/client.ts';
import { auditLog, crews, districts, equipment, fieldChecks, fieldEvents, fields, sites, users, workOrders } from '../../db/schema/index.ts';
import { workOrderRows, type WorkOrderRow } from '../work-orders.ts';
import { stripePatternsOf } from '../stripes.ts';

export interface GenerationInput {
  districtId: number;
  weekStart: string;
}

/** A work order of the week on a field (the engine's; yard jobs are planned apart). */
export type ExistingRow = typeof workOrders.$inferSelect & { fieldId: number; siteId: number };
/** A yard job of the week (no field): blade sharpening. */
export type YardRow = typeof workOrders.$inferSelect;

export async function districtRow(db: Queryable, id: number) {
  const [d] = await db.select({ id: districts.id, name: districts.name, yardName: districts.yardName, yardLat: districts.yardLat, yardLng: districts.yardLng }).from(districts).where(eq(districts.id, id));
  if (!d) throw errors.notFound('district', id);
  return d;
}

export async function districtCrews(db: Queryable, districtId: number) {
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

/** The week's orders on fields (the field engine's input). */
export async function weekRows(db: Queryable, districtId: number, weekStart: string): Promise<ExistingRow[]> {
  const rows = await db
    .select()
    .from(workOrders)
    .where(and(eq(workOrders.districtId, districtId), gte(workOrders.plannedDate, weekStart), lte(workOrders.plannedDate, addDaysIso(weekStart, 6)), isNotNull(workOrders.fieldId)))
    .orderBy(asc(workOrders.id));
  return rows.filter((r): r is ExistingRow => r.fieldId !== null && r.siteId !== null);
}

/** The week's yard jobs (no field). */
export async function yardWeekRows(db: Queryable, districtId: number, weekStart: string): Promise<YardRow[]> {
  return db
    .select()
    .from(workOrders)
    .where(and(eq(workOrders.districtId, districtId), gte(workOrders.plannedDate, weekStart), lte(workOrders.plannedDate, addDaysIso(weekStart, 6)), isNull(workOrders.fieldId)))
    .orderBy(asc(workOrders.id));
}

export async function boardRows(db: Queryable, ids: number[]): Promise<WorkOrderRow[]> {
  const out: WorkOrderRow[] = [];
  // One query per chunk keeps the statement small for very large weeks.
  for (let i = 0; i < ids.length; i += 2000) out.push(...(await workOrderRows(db, ids.slice(i, i + 2000))));
  return out;
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
  for (const r of rows) if (r.last && r.fieldId !== null) out.set(`${r.fieldId}|${r.task}`, r.last);
  const checks = await db.select({ fieldId: fieldChecks.fieldId, last: max(fieldChecks.checkedOn) }).from(fieldChecks).where(inArray(fieldChecks.fieldId, fieldIds)).groupBy(fieldChecks.fieldId);
  for (const c of checks) {
    const key = `${c.fieldId}|field_check`;
    if (c.last && (!out.has(key) || out.get(key)! < c.last)) out.set(key, c.last);
  }
  return out;
}

/** What the week plan's engine reads of a field to make its work. */
export const planFieldColumns = {
  sport: fields.sport,
  grass: fields.grass,
  areaM2: fields.areaM2,
  geometry: fields.geometry,
  maintenanceLevel: fields.maintenanceLevel,
  hocOverrideMm: fields.hocOverrideMm,
  clippings: fields.clippings,
  irrigation: fields.irrigation,
  status: fields.status,
};

async function districtFieldRows(db: Queryable, districtId: number) {
  return db
    .select({
      id: fields.id,
      name: fields.name,
      siteId: fields.siteId,
      siteLat: sites.lat,
      siteLng: sites.lng,
      ...planFieldColumns,
      lastMowedOn: fields.lastMowedOn,
    })
    .from(fields)
    .innerJoin(sites, eq(sites.id, fields.siteId))
    // Retired fields are not kept any more: the week asks nothing of them.
    .where(and(eq(sites.districtId, districtId), ne(fields.status, 'retired')))
    .orderBy(asc(fields.id));
}

export type DistrictFieldRow = Awaited<ReturnType<typeof districtFieldRows>>[number];

/**
 * Cultural work logged done in the season (the calendar year of the week) per field and task,
 * and each field's last field check (its bare share and where the wear is, for overseeding).
 */
async function culturalRecords(db: Queryable, fieldIds: number[], weekStart: string) {
  const culturalOf = new Map<number, Partial<Record<CulturalTask, string[]>>>();
  const wearOf = new Map<number, NonNullable<PlanField['lastWear']>>();
  if (fieldIds.length === 0) return { culturalOf, wearOf };
  const year = weekStart.slice(0, 4);
  const doneRows = await db
    .select({ fieldId: workOrders.fieldId, task: workOrders.task, date: workOrders.plannedDate })
    .from(workOrders)
    .where(and(inArray(workOrders.fieldId, fieldIds), inArray(workOrders.task, [...CULTURAL_TASKS]), eq(workOrders.status, 'done'), gte(workOrders.plannedDate, `${year}-01-01`), lte(workOrders.plannedDate, `${year}-12-31`)));
  for (const r of doneRows) {
    if (r.fieldId === null) continue;
    const byTask = culturalOf.get(r.fieldId) ?? {};
    const task = r.task as CulturalTask;
    byTask[task] = [...(byTask[task] ?? []), r.date];
    culturalOf.set(r.fieldId, byTask);
  }
  const checks = await db
    .selectDistinctOn([fieldChecks.fieldId], { fieldId: fieldChecks.fieldId, checkedOn: fieldChecks.checkedOn, barePct: fieldChecks.barePct, areas: fieldChecks.bareAreas })
    .from(fieldChecks)
    .where(and(inArray(fieldChecks.fieldId, fieldIds), lt(fieldChecks.checkedOn, addDaysIso(weekStart, 7))))
    .orderBy(fieldChecks.fieldId, desc(fieldChecks.checkedOn), desc(fieldChecks.id));
  for (const c of checks) wearOf.set(c.fieldId, { checkedOn: c.checkedOn, barePct: c.barePct, areas: c.areas });
  return { culturalOf, wearOf };
}

/** The district's fields as the engine takes them: with the last work done and the week's events. */
export async function planFields(db: Queryable, q: GenerationInput) {
  const fieldRows = await districtFieldRows(db, q.districtId);
  const done = await lastDone(db, fieldRows.map((f) => f.id));
  const events = await db
    .select({ id: fieldEvents.id, fieldId: fieldEvents.fieldId, startsOn: fieldEvents.startsOn, title: fieldEvents.title })
    .from(fieldEvents)
    .where(and(eq(fieldEvents.districtId, q.districtId), gte(fieldEvents.startsOn, q.weekStart), lte(fieldEvents.startsOn, addDaysIso(q.weekStart, 7))));
  // Paintings of the fortnight before the week, planned or done (not skipped): a booking they were for is served.
  const paintRows = await db
    .select({ fieldId: workOrders.fieldId, date: workOrders.plannedDate, details: workOrders.details })
    .from(workOrders)
    .where(and(eq(workOrders.districtId, q.districtId), eq(workOrders.task, 'paint_lines'), ne(workOrders.status, 'skipped'), gte(workOrders.plannedDate, addDaysIso(q.weekStart, -14)), lt(workOrders.plannedDate, q.weekStart)));
  const paintsOf = new Map<number, { date: string; eventId: number | null }[]>();
  for (const p of paintRows) if (p.fieldId !== null) paintsOf.set(p.fieldId, [...(paintsOf.get(p.fieldId) ?? []), { date: p.date, eventId: typeof p.details.eventId === 'number' ? p.details.eventId : null }]);
  const { culturalOf, wearOf } = await culturalRecords(db, fieldRows.map((f) => f.id), q.weekStart);
  const stripesOf = await stripePatternsOf(db, fieldRows.map((f) => f.id));
  const eventsOf = new Map<number, { id: number; startsOn: string; title: string }[]>();
  for (const e of events) eventsOf.set(e.fieldId, [...(eventsOf.get(e.fieldId) ?? []), e]);
  const toPlanField = (f: DistrictFieldRow): PlanField => ({
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
    paints: paintsOf.get(f.id) ?? [],
    culturalDone: culturalOf.get(f.id) ?? {},
    lastWear: wearOf.get(f.id) ?? null,
    stripes: stripesOf.get(f.id) ?? null,
  });
  return { fieldRows, toPlanField };
}

/** The district's active equipment: mowers with their settings for the engine, and every unit the crews book. */
export async function planEquipment(db: Queryable, districtId: number) {
  const units = await db.select().from(equipment).where(and(eq(equipment.districtId, districtId), eq(equipment.active, true))).orderBy(asc(equipment.id));
  const mowers: PlanMower[] = units.flatMap((u) =>
    MOWER_KINDS.includes(u.kind) && u.cuttingWidthM && u.speedKmh && u.fieldEfficiency && u.hocMinMm !== null && u.hocMaxMm !== null
      ? [{ id: u.id, crewId: u.crewId, kind: u.kind.replace('_mower', '') as PlanMower['kind'], widthM: u.cuttingWidthM, speedKmh: u.speedKmh, efficiency: u.fieldEfficiency, hocMinMm: u.hocMinMm, hocMaxMm: u.hocMaxMm }]
      : [],
  );
  const booked: PlanEquipment[] = units.flatMap((u): PlanEquipment[] => {
    if (MOWER_KINDS.includes(u.kind)) {
      const e: PlanEquipment = { id: u.id, crewId: u.crewId, kind: 'mower', mowerKind: u.kind.replace('_mower', '') as NonNullable<PlanEquipment['mowerKind']> };
      if (u.hocMinMm !== null) e.hocMinMm = u.hocMinMm;
      if (u.hocMaxMm !== null) e.hocMaxMm = u.hocMaxMm;
      return [e];
    }
    if (u.kind === 'line_marker' || u.kind === 'spreader') return [{ id: u.id, crewId: u.crewId, kind: u.kind }];
    return [];
  });
  // Every mower with a sharpening interval, for the yard's blade care.
  const sharpen: SharpenMachine[] = units.flatMap((u) => (MOWER_KINDS.includes(u.kind) && u.sharpenIntervalH !== null ? [{ id: u.id, name: u.name, kind: u.kind, crewId: u.crewId, hourMeterH: u.hourMeterH, sharpenIntervalH: u.sharpenIntervalH, lastSharpenedAtH: u.lastSharpenedAtH }] : []));
  return { mowers, equipment: booked, sharpen };
}

/** Crew hints: the crew that last worked each site in the four weeks before the week's end. */
export async function siteCrewHints(db: Queryable, q: GenerationInput, weekEnd: string) {
  const hintRows = await db
    .select({ siteId: workOrders.siteId, crewId: workOrders.crewId, last: max(workOrders.plannedDate) })
    .from(workOrders)
    .where(and(eq(workOrders.districtId, q.districtId), gte(workOrders.plannedDate, addDaysIso(q.weekStart, -28)), lte(workOrders.plannedDate, weekEnd), sql`${workOrders.crewId} is not null`))
    .groupBy(workOrders.siteId, workOrders.crewId);
  const siteCrewHint = new Map<number, number>();
  const hintDate = new Map<number, string>();
  for (const h of hintRows) {
    if (h.crewId === null || h.siteId === null || !h.last) continue;
    if (!hintDate.has(h.siteId) || hintDate.get(h.siteId)! < h.last) {
      siteCrewHint.set(h.siteId, h.crewId);
      hintDate.set(h.siteId, h.last);
    }
  }
  return siteCrewHint;
}

/** The crew-days of the week a rain-out cancelled (`${crewId}|${date}`; a district's rain-out closes every crew's day). */
export async function rainedOutDays(db: Queryable, q: GenerationInput, crewIds: readonly number[]): Promise<Set<string>> {
  const rows = await db
    .select({ after: auditLog.after })
    .from(auditLog)
    .where(and(eq(auditLog.entity, 'rain_out'), eq(auditLog.districtId, q.districtId), sql`${auditLog.after}->>'date' between ${q.weekStart} and ${addDaysIso(q.weekStart, 6)}`));
  const out = new Set<string>();
  for (const r of rows) {
    const a = r.after as { date?: unknown; crewId?: unknown } | null;
    if (typeof a?.date !== 'string') continue;
    for (const id of typeof a.crewId === 'number' ? [a.crewId] : crewIds) out.add(`${id}|${a.date}`);
  }
  return out;
}
