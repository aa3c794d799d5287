/**
 * The week's yard jobs (blade sharpening) against what is on the board: one job per machine
 * and week, matched by the machine, so re-generating keeps its id. Kept jobs (pinned, started,
 * done, skipped, hand-made) stay; an open generated job for a machine no longer due goes.
 */
import { and, eq, inArray, sql } from 'drizzle-orm';
import { appError, BLADE_CAUTIONS, isKept, type SharpenJob } from '@swardwise/domain';
import type { Queryable } from '../../db/client.ts';
import { workOrders } from '../../db/schema/index.ts';
import type { AuditInput } from '../audit.ts';
import type { Ctx } from '../context.ts';
import type { GenerationInput, YardRow } from './load.ts';

export interface YardReconciliation {
  insert: SharpenJob[];
  update: Array<{ before: YardRow; next: SharpenJob; what: string[] }>;
  remove: YardRow[];
  kept: YardRow[];
  unchanged: YardRow[];
}

export function reconcileYard(existing: readonly YardRow[], jobs: readonly SharpenJob[]): YardReconciliation {
  const rec: YardReconciliation = { insert: [], update: [], remove: [], kept: [], unchanged: [] };
  const sharpenings = existing.filter((e) => e.task === 'sharpen_blades');
  for (const job of jobs) {
    const mine = sharpenings.filter((e) => e.equipmentId === job.equipmentId);
    const kept = mine.find(isKept);
    if (kept) continue;
    const open = mine[0];
    if (!open) {
      rec.insert.push(job);
      continue;
    }
    const what = [open.plannedDate !== job.plannedDate && 'day', open.crewId !== job.crewId && 'crew', open.plannedHours !== job.plannedHours && 'hours'].filter((w): w is string => Boolean(w));
    if (what.length) rec.update.push({ before: open, next: job, what });
    else rec.unchanged.push(open);
  }
  const wanted = new Set(jobs.map((j) => j.equipmentId));
  for (const e of sharpenings) {
    if (isKept(e)) rec.kept.push(e);
    else if (!wanted.has(e.equipmentId ?? -1) || rec.update.some((u) => u.before.id !== e.id && u.before.equipmentId === e.equipmentId) || rec.unchanged.some((u) => u.id !== e.id && u.equipmentId === e.equipmentId)) {
      rec.remove.push(e);
    }
  }
  return rec;
}

const detailsOf = (j: SharpenJob) => ({ ...j.details, cautions: [...BLADE_CAUTIONS] });

/** Writes the yard's part of a generated week inside the week's transaction; audits go into `audits`. */
export async function writeYardJobs(ctx: Ctx, tx: Queryable, q: GenerationInput, rec: YardReconciliation, audits: AuditInput[]): Promise<void> {
  await removeGeneratedOrders(ctx, tx, rec.remove, audits);
  for (const u of rec.update) {
    const [after] = await tx
      .update(workOrders)
      .set({ plannedDate: u.next.plannedDate, weekStart: q.weekStart, plannedHours: u.next.plannedHours, crewId: u.next.crewId, reason: u.next.reason, details: detailsOf(u.next), status: 'planned', version: sql`${workOrders.version} + 1`, updatedAt: new Date() })
      .where(and(eq(workOrders.id, u.before.id), eq(workOrders.version, u.before.version), eq(workOrders.pinned, false)))
      .returning();
    if (!after) throw weekChanged();
    audits.push({ actorId: ctx.actor.id, action: 'update', entity: 'work_order', entityId: after.id, districtId: after.districtId, before: u.before, after });
  }
  for (const job of rec.insert) {
    const [row] = await tx
      .insert(workOrders)
      .values({
        fieldId: null,
        siteId: null,
        districtId: q.districtId,
        task: 'sharpen_blades',
        weekStart: q.weekStart,
        plannedDate: job.plannedDate,
        crewId: job.crewId,
        equipmentId: job.equipmentId,
        plannedHours: job.plannedHours,
        status: 'planned',
        origin: 'generated',
        pinned: false,
        reason: job.reason,
        details: detailsOf(job),
        createdBy: ctx.actor.id,
      })
      .returning();
    audits.push({ actorId: ctx.actor.id, action: 'create', entity: 'work_order', entityId: row!.id, districtId: q.districtId, before: null, after: row! });
  }
}

/**
 * Deletes the generated orders a new run drops, each only while still open, unpinned and
 * generated: one taken up meanwhile means the week changed under the run (409). Their audit
 * entries go into `audits`.
 */
export async function removeGeneratedOrders(ctx: Ctx, tx: Queryable, rows: readonly YardRow[], audits: AuditInput[]): Promise<void> {
  if (!rows.length) return;
  const gone = await tx
    .delete(workOrders)
    .where(and(inArray(workOrders.id, rows.map((r) => r.id)), eq(workOrders.pinned, false), eq(workOrders.origin, 'generated'), inArray(workOrders.status, ['planned', 'assigned'])))
    .returning({ id: workOrders.id });
  if (gone.length !== rows.length) throw weekChanged();
  for (const r of rows) audits.push({ actorId: ctx.actor.id, action: 'delete', entity: 'work_order', entityId: r.id, districtId: r.districtId, before: r, after: null });
}

export const weekChanged = () => appError('week_plan/changed', 'The week changed while it was being generated (someone assigned or moved work); generate again to see the current plan');
