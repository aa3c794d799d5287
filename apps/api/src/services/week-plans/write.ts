/**
 * Writing a generated week: deletes, updates and inserts in one transaction, every one
 * audited plus one entry for the run; bulk statements keep large weeks fast.
 */
import { and, eq, sql } from 'drizzle-orm';
import type { ScheduledOrder, WeekReconciliation } from '@swardwise/domain';
import type { Db, Queryable } from '../../db/client.ts';
import { workOrders } from '../../db/schema/index.ts';
import { writeAudit, type AuditInput } from '../audit.ts';
import type { Ctx } from '../context.ts';
import type { ExistingRow, GenerationInput } from './load.ts';
import { removeGeneratedOrders, weekChanged, writeYardJobs, type YardReconciliation } from './yard.ts';

/** The reconciled week written: `summary` and `warnings` go into the run's audit entry. */
export async function writeGeneratedWeek(ctx: Ctx, q: GenerationInput, rec: WeekReconciliation<ExistingRow, ScheduledOrder>, planOrders: ScheduledOrder[], summary: Record<string, number>, warnings: string[], yard?: YardReconciliation): Promise<void> {
  await (ctx.db as Db).transaction(async (tx) => {
  const audits: AuditInput[] = [];
  await removeGeneratedOrders(ctx, tx, rec.remove, audits);
  for (const u of rec.update) {
    const p = u.next;
    const [after] = await tx
      .update(workOrders)
      .set({ plannedDate: p.plannedDate, weekStart: q.weekStart, plannedHours: p.plannedHours, crewId: p.crewId, equipmentId: p.equipmentId, reason: p.reason, details: { ...p.details, dueBy: p.latestDate }, status: 'planned', version: sql`${workOrders.version} + 1`, updatedAt: new Date() })
      .where(and(eq(workOrders.id, u.id), eq(workOrders.version, u.before.version), eq(workOrders.pinned, false)))
      .returning();
    if (!after) throw weekChanged();
    audits.push({ actorId: ctx.actor.id, action: 'update', entity: 'work_order', entityId: u.id, districtId: after.districtId, before: u.before, after });
  }
  // Unchanged orders take the newest reasons and details (heights, run times) without a new version.
  const planned = new Map(planOrders.map((o) => [`${o.fieldId}|${o.task}|${o.plannedDate}`, o]));
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
  if (yard) await writeYardJobs(ctx, tx, q, yard, audits);
  audits.push({ actorId: ctx.actor.id, action: 'create', entity: 'week_plan', entityId: null, districtId: q.districtId, before: null, after: { weekStart: q.weekStart, ...summary, warnings } });
  await writeAudit(tx, audits);
  });
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

