/**
 * Field checks: a crew logs one from Today on a field-check work order; the turf engine scores
 * it and flags what needs doing; the check is stored in `field_checks` and the order is done.
 */
import { desc, eq, sql } from 'drizzle-orm';
import { appError, errors, hocFor, judgeFieldCheck, type FieldCheckAnswer, type FieldCheckBody, type FieldCheckFlag, type FieldCheckList, type FieldCheckRow } from '@swardwise/domain';
import type { Db, Queryable } from '../db/client.ts';
import { fieldChecks, fields, users } from '../db/schema/index.ts';
import { writeAudit } from './audit.ts';
import { authorize, type Ctx } from './context.ts';
import { getField } from './fields.ts';
import { loadParameters, loadStandards } from './standards.ts';
import { orderFor, reportWork } from './work-reports.ts';

const checkColumns = {
  id: fieldChecks.id,
  fieldId: fieldChecks.fieldId,
  checkedOn: fieldChecks.checkedOn,
  checkedBy: fieldChecks.checkedBy,
  checkedByName: sql<string | null>`${users.name}`,
  turfCoverPct: fieldChecks.turfCoverPct,
  weedsPct: fieldChecks.weedsPct,
  barePct: fieldChecks.barePct,
  bareAreas: fieldChecks.bareAreas,
  heightMm: fieldChecks.heightMm,
  gmax: fieldChecks.gmax,
  gmaxDevice: fieldChecks.gmaxDevice,
  hardnessReadings: fieldChecks.hardnessReadings,
  evenness: fieldChecks.evenness,
  divots: fieldChecks.divots,
  tornLeafTips: fieldChecks.tornLeafTips,
  notes: fieldChecks.notes,
  score: fieldChecks.score,
  flags: sql<FieldCheckFlag[]>`${fieldChecks.flags}`,
  workOrderId: fieldChecks.workOrderId,
  createdAt: fieldChecks.createdAt,
};

async function checkRows(db: Queryable, where: ReturnType<typeof eq>, limit: number): Promise<FieldCheckRow<Date>[]> {
  return db.select(checkColumns).from(fieldChecks).leftJoin(users, eq(users.id, fieldChecks.checkedBy)).where(where).orderBy(desc(fieldChecks.checkedOn), desc(fieldChecks.id)).limit(limit);
}

/** The latest checks of a field a caller may read, newest first. */
export async function listFieldChecks(ctx: Ctx, fieldId: number, limit = 20): Promise<FieldCheckList<Date>> {
  await getField(ctx, fieldId);
  authorize(ctx, 'read', 'FieldCheck');
  return { items: await checkRows(ctx.db, eq(fieldChecks.fieldId, fieldId), limit) };
}

/** A crew's field check logged on its work order; see the module comment. */
export async function logFieldCheck(ctx: Ctx, orderId: number, input: FieldCheckBody): Promise<FieldCheckAnswer<Date>> {
  const order = await orderFor(ctx, orderId, 'log');
  if (order.task !== 'field_check') throw appError('field_check/not_a_check', 'This work order is not a field check; report it with Done instead', { task: order.task });
  if (order.status === 'done') throw appError('work_report/already_done', 'This field check is already logged; reopen the job to log it again', { status: order.status });
  authorize(ctx, 'create', 'FieldCheck', { districtId: order.districtId });
  const [field] = await ctx.db
    .select({ id: fields.id, sport: fields.sport, grass: fields.grass, maintenanceLevel: fields.maintenanceLevel, hocOverrideMm: fields.hocOverrideMm })
    .from(fields)
    .where(eq(fields.id, order.fieldId));
  if (!field) throw errors.notFound('field', order.fieldId);
  const [{ standards }, parameters] = [await loadStandards(ctx.db), await loadParameters(ctx.db)];
  const hocMm = hocFor(field, standards);
  const result = judgeFieldCheck(input, { hocMm, level: field.maintenanceLevel, ranges: parameters.hardnessRangesG });
  const id = await (ctx.db as Db).transaction(async (tx) => {
    const [row] = await tx
      .insert(fieldChecks)
      .values({
        fieldId: field.id,
        checkedOn: ctx.clock.today(),
        checkedBy: ctx.actor.id,
        turfCoverPct: input.turfCoverPct,
        weedsPct: input.weedsPct,
        barePct: input.bareWornPct,
        bareAreas: input.bareAreas,
        heightMm: input.heightMm,
        gmax: result.hardnessG,
        gmaxDevice: result.hardnessG === null ? null : input.hardnessDevice,
        hardnessReadings: input.hardnessReadingsG,
        evenness: input.evenness,
        divots: input.divots,
        tornLeafTips: input.tornLeafTips,
        notes: input.notes,
        score: Math.round(result.score * 10) / 10,
        flags: result.flags,
        workOrderId: orderId,
      })
      .returning();
    await writeAudit(tx, { actorId: ctx.actor.id, action: 'create', entity: 'field_check', entityId: row!.id, districtId: order.districtId, before: null, after: row! });
    return row!.id;
  });
  const summary = `Field check: score ${Math.round(result.score)}${result.flags.length ? ` · ${result.flags.join(', ').replaceAll('_', ' ')}` : ''}${input.notes ? ` · ${input.notes}` : ''}`;
  await reportWork(ctx, orderId, { status: 'done', actualHours: input.actualHours ?? order.plannedHours, note: summary.slice(0, 2000) });
  const [check] = await checkRows(ctx.db, eq(fieldChecks.id, id), 1);
  return { check: check!, advice: result.advice, cautions: result.cautions, coverTargetPct: result.coverTargetPct, hocMm };
}
