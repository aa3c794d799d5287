/**
 * Writes the demo's season of history (`buildDemoSeason`) in a handful of statements: the
 * rows travel as one JSON parameter each (json_to_recordset), which PGlite takes far faster
 * than thousands of bound parameters, so a fresh demo database stays quick to make.
 */
import { sql } from 'drizzle-orm';
import { DEFAULT_STANDARDS, hocFor, localDateOf, localTimeOf, type Level } from '@swardwise/domain';
import type { Queryable } from '../client.ts';
import { fieldChecks, workOrders, workUpdates } from '../schema/index.ts';
import type { DemoCity } from './demo-city.ts';
import type { DemoSeason } from './demo-season.ts';
import { demoCheckRow } from './demo-history.ts';

export interface SeasonIds {
  fieldIds: number[];
  siteIdOf: (siteKey: string) => number;
  districtIdOf: (siteKey: string) => number;
  crewIdOf: (crewName: string) => number;
  /** The crew lead's account, who reports the crew's work. */
  crewUserOf: (crewName: string) => number | null;
}

/** The instant of a wall-clock time on a department-local date (the crew's report, mid-afternoon). */
function localMoment(date: string, time: string, timeZone: string): string {
  const guess = Date.parse(`${date}T${time}:00Z`);
  const wall = Date.parse(`${localDateOf(guess, timeZone)}T${localTimeOf(guess, timeZone)}:00Z`);
  return new Date(guess - (wall - guess)).toISOString();
}

export async function insertDemoSeason(tx: Queryable, city: DemoCity, season: DemoSeason, ids: SeasonIds, timeZone: string): Promise<{ workOrders: number; fieldChecks: number }> {
  const reportedAt = (date: string) => localMoment(date, '15:30', timeZone);
  const orders = season.orders.map((o) => {
    const f = city.fields[o.fieldIndex]!;
    const done = o.status === 'done';
    return {
      fieldId: ids.fieldIds[o.fieldIndex]!,
      siteId: ids.siteIdOf(f.siteKey),
      districtId: ids.districtIdOf(f.siteKey),
      task: o.task,
      weekStart: o.weekStart,
      plannedDate: o.plannedDate,
      crewId: ids.crewIdOf(o.crewName),
      plannedHours: o.plannedHours,
      actualHours: o.actualHours,
      status: o.status,
      reason: o.reason,
      details: o.details,
      notes: o.notes,
      doneAt: done && o.doneOn ? reportedAt(o.doneOn) : null,
      doneBy: done ? ids.crewUserOf(o.crewName) : null,
      reportedAt: reportedAt(o.doneOn ?? o.plannedDate),
      reportedBy: ids.crewUserOf(o.crewName),
    };
  });
  if (orders.length) {
    // The orders, then the crew's reports, matched by field, task and day (the field index).
    await tx.execute(sql`
      insert into ${workOrders} (field_id, site_id, district_id, task, week_start, planned_date, crew_id, planned_hours, actual_hours, status, origin, pinned, reason, details, notes, done_at, done_by)
      select "fieldId", "siteId", "districtId", task, "weekStart", "plannedDate", "crewId", "plannedHours", "actualHours", status, 'generated', true, reason, details, notes, "doneAt", "doneBy"
      from json_to_recordset(${JSON.stringify(orders)}::json) as x(
        "fieldId" int, "siteId" int, "districtId" int, task text, "weekStart" date, "plannedDate" date, "crewId" int,
        "plannedHours" real, "actualHours" real, status text, reason text, details jsonb, notes text, "doneAt" timestamptz, "doneBy" int)`);
    // Reports kept for the jobs the crew wrote a note on (skipped or late): the rest say only "done".
    const reports = orders.filter((o) => o.notes !== '').map((o) => ({ fieldId: o.fieldId, task: o.task, plannedDate: o.plannedDate, reportedAt: o.reportedAt, reportedBy: o.reportedBy }));
    await tx.execute(sql`
      insert into ${workUpdates} (work_order_id, status, actual_hours, note, reported_at, created_by)
      select w.id, w.status, w.actual_hours, w.notes, x."reportedAt", x."reportedBy"
      from json_to_recordset(${JSON.stringify(reports)}::json) as x("fieldId" int, task text, "plannedDate" date, "reportedAt" timestamptz, "reportedBy" int)
      join ${workOrders} w on w.field_id = x."fieldId" and w.planned_date = x."plannedDate" and w.task = x.task and w.status in ('done', 'skipped')`);
  }

  const checks = season.checks.map((c) => {
    const f = city.fields[c.fieldIndex]!;
    const hocMm = hocFor({ ...f, maintenanceLevel: f.maintenanceLevel as Level }, DEFAULT_STANDARDS);
    return demoCheckRow(ids.fieldIds[c.fieldIndex]!, c, hocMm, Math.round(c.heightRatio * hocMm));
  });
  if (checks.length) {
    await tx.execute(sql`
      insert into ${fieldChecks} (field_id, checked_on, turf_cover_pct, weeds_pct, bare_pct, height_mm, days_since_cut, gmax, gmax_device, evenness, notes, score, flags)
      select "fieldId", "checkedOn", "turfCoverPct", "weedsPct", "barePct", "heightMm", "daysSinceCut", gmax, "gmaxDevice", evenness, notes, score, flags
      from json_to_recordset(${JSON.stringify(checks)}::json) as x(
        "fieldId" int, "checkedOn" date, "turfCoverPct" real, "weedsPct" real, "barePct" real, "heightMm" real, "daysSinceCut" int,
        gmax real, "gmaxDevice" text, evenness int, notes text, score real, flags jsonb)`);
  }
  return { workOrders: orders.length, fieldChecks: checks.length };
}
