/**
 * Records of work: planned against actual hours per field, crew and week, and mowings done
 * against those the one-third rule asked for. A mowing done after the date it was due by is
 * counted late; one not done by its day is counted missed.
 */
import { and, asc, eq, gte, lte } from 'drizzle-orm';
import type { CrewNote, DateRangeQuery, RecordTally, Records } from '@swardwise/domain';
import { crews, districts, fields, sites, workOrders } from '../db/schema/index.ts';
import { authorize, can, type Ctx } from './context.ts';
import { readScope, workOrderColumns } from './work-orders.ts';
import { photosOf, updatesOf } from './work-reports.ts';

type Tally = RecordTally;
/** The columns records read of each work order. */
const { id, fieldId, fieldName, siteId, siteName, districtId, crewId, crewName, task, weekStart, plannedDate, plannedHours, actualHours, status, doneAt, details } = workOrderColumns;

const empty = (): Tally => ({ plannedHours: 0, actualHours: 0, plannedHoursDone: 0, ordersDone: 0, ordersSkipped: 0, ordersOpen: 0, mowingsAsked: 0, mowingsDone: 0, mowingsLate: 0, mowingsMissed: 0 });
const r2 = (v: number) => Math.round(v * 100) / 100;
const finish = <T extends Tally>(t: T): T => ({ ...t, plannedHours: r2(t.plannedHours), actualHours: r2(t.actualHours), plannedHoursDone: r2(t.plannedHoursDone) });

/**
 * Records over a range. `onlyFieldId` narrows them to one field: the field page's planned
 * against done is this same tally, so it and Records never disagree.
 */
export async function getRecords(ctx: Ctx, q: DateRangeQuery, today = ctx.clock.today(), onlyFieldId?: number): Promise<Records> {
  authorize(ctx, 'read', 'WorkOrder', q.districtId ? { districtId: q.districtId } : undefined);
  const conditions = [gte(workOrders.plannedDate, q.from), lte(workOrders.plannedDate, q.to), readScope(ctx)];
  if (q.districtId) conditions.push(eq(workOrders.districtId, q.districtId));
  if (onlyFieldId !== undefined) conditions.push(eq(workOrders.fieldId, onlyFieldId));
  const rows = (
    await ctx.db
      .select({ id, fieldId, fieldName, siteId, siteName, districtId, crewId, crewName, task, weekStart, plannedDate, plannedHours, actualHours, status, doneAt, details })
      .from(workOrders)
      // Left joins: a yard job (no field) counts for its crew and week, not for any field.
      .leftJoin(fields, eq(fields.id, workOrders.fieldId))
      .leftJoin(sites, eq(sites.id, workOrders.siteId))
      .innerJoin(districts, eq(districts.id, workOrders.districtId))
      .leftJoin(crews, eq(crews.id, workOrders.crewId))
      .where(and(...conditions))
      .orderBy(asc(workOrders.plannedDate), asc(workOrders.id))
  ).filter((r) => can(ctx, 'read', 'WorkOrder', r));

  const byField = new Map<number, Tally & { fieldId: number; fieldName: string; siteName: string }>();
  const byCrew = new Map<string, Tally & { crewId: number | null; crewName: string }>();
  const byWeek = new Map<string, Tally & { weekStart: string }>();
  const totals = empty();
  const late: Array<{ id: number; fieldName: string; siteName: string; dueBy: string; doneOn: string; daysLate: number }> = [];
  for (const r of rows) {
    const f = r.fieldId === null ? null : (byField.get(r.fieldId) ?? { ...empty(), fieldId: r.fieldId, fieldName: r.fieldName, siteName: r.siteName });
    const crewKey = String(r.crewId ?? 'none');
    const c = byCrew.get(crewKey) ?? { ...empty(), crewId: r.crewId, crewName: r.crewName ?? 'No crew' };
    const w = byWeek.get(r.weekStart) ?? { ...empty(), weekStart: r.weekStart };
    // The department's date of the moment it was done: 23:30 local is still that day.
    const doneOn = r.doneAt ? ctx.clock.dateOf(r.doneAt) : null;
    const dueBy = typeof r.details.dueBy === 'string' ? r.details.dueBy : r.plannedDate;
    const isLate = r.status === 'done' && doneOn !== null && doneOn > dueBy;
    if (r.task === 'mow' && isLate && doneOn) late.push({ id: r.id, fieldName: r.fieldName, siteName: r.siteName, dueBy, doneOn, daysLate: Math.round((Date.parse(doneOn) - Date.parse(dueBy)) / 86_400_000) });
    for (const t of f ? [f, c, w, totals] : [c, w, totals]) {
      t.plannedHours += r.plannedHours;
      if (r.status === 'done') {
        t.ordersDone++;
        t.actualHours += r.actualHours ?? 0;
        t.plannedHoursDone += r.plannedHours;
      } else if (r.status === 'skipped') t.ordersSkipped++;
      else t.ordersOpen++;
      if (r.task === 'mow') {
        t.mowingsAsked++;
        if (r.status === 'done') t.mowingsDone++;
        if (isLate) t.mowingsLate++;
        if (r.status !== 'done' && r.plannedDate < today) t.mowingsMissed++;
      }
    }
    if (f && r.fieldId !== null) byField.set(r.fieldId, f);
    byCrew.set(crewKey, c);
    byWeek.set(r.weekStart, w);
  }
  return {
    crewNotes: await crewNotes(ctx, rows),
    from: q.from,
    to: q.to,
    districtId: q.districtId ?? null,
    asOf: today,
    byField: [...byField.values()].map(finish).sort((a, b) => a.siteName.localeCompare(b.siteName) || a.fieldName.localeCompare(b.fieldName)),
    byCrew: [...byCrew.values()].map(finish).sort((a, b) => a.crewName.localeCompare(b.crewName)),
    byWeek: [...byWeek.values()].map(finish).sort((a, b) => (a.weekStart < b.weekStart ? -1 : 1)),
    lateMowings: late.sort((a, b) => b.daysLate - a.daysLate || a.id - b.id),
    totals: finish(totals),
  };
}

/** The most jobs with crew notes one records answer lists. */
const CREW_NOTES_MAX = 200;

/** The jobs of the range a crew wrote a note on or took photos of, newest report first. */
async function crewNotes(ctx: Ctx, rows: ReadonlyArray<{ id: number; fieldId: number | null; fieldName: string; siteName: string; task: CrewNote['task']; crewName: string | null; status: CrewNote['status'] }>): Promise<CrewNote[]> {
  const ids = rows.map((r) => r.id);
  const [updates, photos] = [await updatesOf(ctx.db, ids), await photosOf(ctx.db, ids)];
  const out = new Map<number, CrewNote & { last: number }>();
  const entry = (orderId: number) => {
    let e = out.get(orderId);
    if (!e) {
      const r = rows.find((x) => x.id === orderId)!;
      e = { orderId, fieldId: r.fieldId, fieldName: r.fieldName, siteName: r.siteName, task: r.task, crewName: r.crewName, status: r.status, reportedOn: '', notes: [], photos: [], last: 0 };
      out.set(orderId, e);
    }
    return e;
  };
  for (const u of updates) {
    if (!u.note) continue;
    const e = entry(u.workOrderId);
    e.notes.push(u.note);
    if (u.reportedAt.getTime() >= e.last) Object.assign(e, { last: u.reportedAt.getTime(), reportedOn: ctx.clock.dateOf(u.reportedAt) });
  }
  for (const p of photos) {
    const e = entry(p.workOrderId);
    e.photos.push({ id: p.id, url: p.url });
    if (p.createdAt.getTime() >= e.last) Object.assign(e, { last: p.createdAt.getTime(), reportedOn: ctx.clock.dateOf(p.createdAt) });
  }
  return [...out.values()]
    .sort((a, b) => b.last - a.last || b.orderId - a.orderId)
    .slice(0, CREW_NOTES_MAX)
    .map(({ last: _last, ...note }) => (void _last, note));
}
