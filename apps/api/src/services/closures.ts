/**
 * Closing, restricting and reopening fields. Each decision is a row of `field_closures` (the
 * one in force has no `to_at`) and sets `fields.status` in the same transaction, so the code
 * that reads a field's status needs no join. Closing a field with planned work decides, in
 * that transaction, what becomes of it: kept, moved to the next open working day, or
 * cancelled with the closure's reason. Partners of the site hear of it by e-mail.
 */
import { and, desc, eq, gte, inArray, isNull, lt, sql } from 'drizzle-orm';
import {
  addDaysIso,
  closureCaution,
  closureSuggestion,
  CLOSURE_REASON_LABELS,
  CLOSURE_REASON_PUBLIC,
  errors,
  appError,
  levelStandard,
  mondayOf,
  nextWorkingDay,
  type CloseFieldInput,
  type ClosureReason,
  type ClosureStatus,
  type FieldClosureAnswer,
  type FieldClosureRow,
  type FieldClosures,
  type ReopenFieldInput,
  type Weekday,
} from '@swardwise/domain';
import type { Db, Queryable, Tx } from '../db/client.ts';
import { crews, fieldChecks, fieldClosures, fields, sites, userSites, users, workOrders } from '../db/schema/index.ts';
import type { BackgroundTasks } from './background.ts';
import type { Mailer } from '../mail/mailer.ts';
import { closureMail } from '../mail/messages.ts';
import { writeAudit } from './audit.ts';
import { authorize, can, type Ctx } from './context.ts';
import { fieldCrewIds, onFieldJoins } from './scope.ts';
import { loadParameters, loadStandards } from './standards.ts';
import { notifyCrews, type WorkMoveNotice } from './work-orders.ts';
import { auditedRow, updateAtVersion, writable } from './versioned.ts';

/** How far ahead of the server's clock a closure may be said to start (a phone's clock running fast). */
const FUTURE_SLACK_MS = 5 * 60_000;
const HISTORY_LIMIT = 50;
/** The work closing a field asks about: not yet started. */
const OPEN_WORK = ['planned', 'assigned'] as const;

export interface ClosureDeps {
  mailer: Mailer;
  publicUrl: string;
  background: BackgroundTasks;
}

const columns = {
  id: fieldClosures.id,
  fieldId: fieldClosures.fieldId,
  siteId: fields.siteId,
  districtId: sites.districtId,
  status: fieldClosures.status,
  reason: fieldClosures.reason,
  note: fieldClosures.note,
  fromAt: fieldClosures.fromAt,
  toAt: fieldClosures.toAt,
  expectedReopenOn: fieldClosures.expectedReopenOn,
  decidedBy: fieldClosures.decidedBy,
  decidedByName: users.name,
  workChoice: fieldClosures.workChoice,
  workCount: fieldClosures.workCount,
};

function selectClosures(db: Queryable) {
  return onFieldJoins(db.select(columns).from(fieldClosures).$dynamic(), { fieldId: fieldClosures.fieldId, siteId: fields.siteId, by: fieldClosures.decidedBy });
}

/** The field as a closure needs it: its scope, status, version, level and names. */
async function fieldRow(db: Queryable, id: number) {
  const [row] = await db
    .select({
      id: fields.id,
      name: fields.name,
      siteId: fields.siteId,
      siteName: sites.name,
      districtId: sites.districtId,
      status: fields.status,
      statusNote: fields.statusNote,
      maintenanceLevel: fields.maintenanceLevel,
      version: fields.version,
      // A crew lead reads the fields of his crew's work: the ability needs the crews.
      crewIds: fieldCrewIds,
    })
    .from(fields)
    .innerJoin(sites, eq(sites.id, fields.siteId))
    .where(eq(fields.id, id));
  return row;
}

/** Planned or assigned work on the field from `from` on, before `before` when given. */
async function openWork(db: Queryable, fieldId: number, from: string, before: string | null) {
  return db
    .select({ order: workOrders, crewName: crews.name, workDays: crews.workDays })
    .from(workOrders)
    .leftJoin(crews, eq(crews.id, workOrders.crewId))
    .where(
      and(
        eq(workOrders.fieldId, fieldId),
        inArray(workOrders.status, [...OPEN_WORK]),
        gte(workOrders.plannedDate, from),
        before ? lt(workOrders.plannedDate, before) : undefined,
      ),
    )
    .orderBy(workOrders.plannedDate, workOrders.id);
}

export async function getFieldClosures(ctx: Ctx, fieldId: number): Promise<FieldClosures<Date>> {
  const field = await fieldRow(ctx.db, fieldId);
  if (!field) throw errors.notFound('field', fieldId);
  authorize(ctx, 'read', 'Field', field);
  authorize(ctx, 'read', 'FieldClosure', field);
  const history = await selectClosures(ctx.db).where(eq(fieldClosures.fieldId, fieldId)).orderBy(desc(fieldClosures.fromAt), desc(fieldClosures.id)).limit(HISTORY_LIMIT);
  const mayClose = can(ctx, 'create', 'FieldClosure', field);
  // Only those who may close see the work it would touch (a partner does not read the crews' work).
  const work = mayClose ? await openWork(ctx.db, fieldId, ctx.clock.today(), null) : [];
  let suggestion = null;
  if (field.status === 'open') {
    const [check] = await ctx.db
      .select({ checkedOn: fieldChecks.checkedOn, score: fieldChecks.score, gmax: fieldChecks.gmax, gmaxDevice: fieldChecks.gmaxDevice })
      .from(fieldChecks)
      .where(eq(fieldChecks.fieldId, fieldId))
      .orderBy(desc(fieldChecks.checkedOn), desc(fieldChecks.id))
      .limit(1);
    if (check) {
      const [parameters, { standards }] = await Promise.all([loadParameters(ctx.db), loadStandards(ctx.db)]);
      suggestion = closureSuggestion(check, parameters.hardnessRangesG, levelStandard(field.maintenanceLevel, standards).targetScore);
    }
  }
  return {
    fieldId,
    status: field.status,
    version: field.version,
    current: history.find((h) => h.toAt === null) ?? null,
    history,
    plannedWork: work.map((w) => ({ id: w.order.id, task: w.order.task, plannedDate: w.order.plannedDate, status: w.order.status, crewName: w.crewName })),
    suggestion,
  };
}

type Decision = { status: ClosureStatus; reason: ClosureReason | null; note: string; fromAt: Date; expectedReopenOn: string | null };
type WorkDone = FieldClosureAnswer['work'] & { notices: WorkMoveNotice[] };

/** Ends the decision in force and records the new one; returns the new row. */
async function recordDecision(ctx: Ctx, tx: Tx, field: NonNullable<Awaited<ReturnType<typeof fieldRow>>>, version: number, decision: Decision, work: { choice: CloseFieldInput['work'] | null; count: number }) {
  const [current] = await tx.select({ fromAt: fieldClosures.fromAt }).from(fieldClosures).where(and(eq(fieldClosures.fieldId, field.id), isNull(fieldClosures.toAt)));
  if (current && decision.fromAt < current.fromAt) {
    throw errors.invalid('A change of status cannot start before the one in force', [{ path: 'body.fromAt', message: `must not be before ${current.fromAt.toISOString()}, when the status in force began` }]);
  }
  // The version is checked first, so two people closing at once do not both end the current row.
  const statusNote = decision.reason ? `${CLOSURE_REASON_LABELS[decision.reason]}${decision.note ? `: ${decision.note}` : ''}` : '';
  await updateAtVersion(tx, fields, 'field', field.id, version, { status: decision.status, statusNote });
  await tx.update(fieldClosures).set({ toAt: decision.fromAt }).where(and(eq(fieldClosures.fieldId, field.id), isNull(fieldClosures.toAt)));
  const [inserted] = await tx
    .insert(fieldClosures)
    .values({ fieldId: field.id, ...decision, decidedBy: ctx.actor.id, workChoice: work.count ? (work.choice ?? null) : null, workCount: work.count })
    .returning({ id: fieldClosures.id });
  const row = (await selectClosures(tx).where(eq(fieldClosures.id, inserted!.id)))[0]!;
  const after = await auditedRow(ctx, tx, 'field', field, field.id, fieldRow);
  await writeAudit(tx, { actorId: ctx.actor.id, action: 'create', entity: 'field_closure', entityId: row.id, districtId: field.districtId, before: null, after: row as unknown as Record<string, unknown> });
  return { row, fieldVersion: after.version };
}

/** Keeps, moves or cancels the planned work of a field being closed; audits every changed order. */
async function settleWork(ctx: Ctx, tx: Tx, field: { districtId: number; name: string; siteName: string }, input: CloseFieldInput, work: Awaited<ReturnType<typeof openWork>>): Promise<WorkDone> {
  const done: WorkDone = { kept: [], moved: [], cancelled: [], notices: [] };
  const byCrew = new Map<number, WorkMoveNotice>();
  const notice = (crewId: number | null, kind: 'moved' | 'removed') => {
    if (crewId === null) return null;
    const key = crewId * 2 + (kind === 'moved' ? 0 : 1);
    let n = byCrew.get(key);
    if (!n) byCrew.set(key, (n = { crewId, kind, orders: [] }));
    return n;
  };
  const firstOpenDay = input.expectedReopenOn && input.expectedReopenOn > ctx.clock.today() ? input.expectedReopenOn : addDaysIso(ctx.clock.today(), 1);
  for (const { order, workDays } of work) {
    if (input.work === 'keep') {
      done.kept.push(order.id);
      continue;
    }
    const changes =
      input.work === 'move'
        ? (() => {
            const to = nextWorkingDay(firstOpenDay, (workDays ?? []) as Weekday[]);
            return { plannedDate: to, weekStart: mondayOf(to), pinned: true };
          })()
        : { status: 'skipped' as const, pinned: true, notes: [order.notes, `Cancelled: field ${input.status} (${CLOSURE_REASON_LABELS[input.reason].toLowerCase()})`].filter(Boolean).join('\n') };
    const [after] = await tx
      .update(workOrders)
      .set({ ...changes, version: sql`${workOrders.version} + 1`, updatedAt: new Date() })
      .where(eq(workOrders.id, order.id))
      .returning();
    await writeAudit(tx, { actorId: ctx.actor.id, action: 'update', entity: 'work_order', entityId: order.id, districtId: order.districtId, before: order, after: after ?? null });
    const line = { task: order.task, fieldName: field.name, siteName: field.siteName, plannedHours: order.plannedHours };
    if (input.work === 'move') {
      done.moved.push({ id: order.id, from: order.plannedDate, to: after!.plannedDate });
      notice(order.crewId, 'moved')?.orders.push({ ...line, plannedDate: after!.plannedDate, fromDate: order.plannedDate });
    } else {
      done.cancelled.push(order.id);
      notice(order.crewId, 'removed')?.orders.push({ ...line, plannedDate: order.plannedDate });
    }
  }
  done.notices = [...byCrew.values()];
  return done;
}

/** The partners of a site who can receive e-mail. */
async function sitePartners(db: Queryable, siteId: number) {
  return db
    .select({ email: users.email, name: users.name })
    .from(users)
    .innerJoin(userSites, eq(userSites.userId, users.id))
    .where(and(eq(userSites.siteId, siteId), eq(users.role, 'partner'), eq(users.active, true)));
}

/** After the commit: the site's partners, and crew leads whose work moved or was cancelled. A failed e-mail never undoes the decision. */
function tellPeople(ctx: Ctx, deps: ClosureDeps, field: { siteId: number; name: string; siteName: string }, decision: Decision, notices: WorkMoveNotice[]) {
  deps.background.run('closure e-mail', async () => {
    const notice = {
      fieldName: field.name,
      siteName: field.siteName,
      status: decision.status,
      reason: decision.reason ? CLOSURE_REASON_PUBLIC[decision.reason] : null,
      expectedReopenOn: decision.expectedReopenOn,
      caution: decision.reason ? closureCaution(decision.reason) : null,
    };
    for (const p of await sitePartners(ctx.db, field.siteId)) await deps.mailer.send(closureMail(p.email, p.name, notice, deps.publicUrl));
    await notifyCrews(ctx.db, deps.mailer, notices, ctx.actorName, deps.publicUrl);
  });
}

function startOf(ctx: Ctx, fromAt: string | undefined): Date {
  const now = ctx.clock.now();
  if (fromAt === undefined) return now;
  const at = new Date(fromAt);
  if (at.getTime() > now.getTime() + FUTURE_SLACK_MS) {
    throw errors.invalid('A closure starts now or earlier; set the expected reopening for what lies ahead', [{ path: 'body.fromAt', message: 'must not be in the future' }]);
  }
  return at;
}

export async function closeField(ctx: Ctx, deps: ClosureDeps, fieldId: number, input: CloseFieldInput): Promise<FieldClosureAnswer<Date>> {
  const fromAt = startOf(ctx, input.fromAt);
  const today = ctx.clock.today();
  if (input.expectedReopenOn !== null && input.expectedReopenOn < today) {
    throw errors.invalid('The expected reopening is in the past', [{ path: 'body.expectedReopenOn', message: `must be ${today} or later` }]);
  }
  const result = await (ctx.db as Db).transaction(async (tx) => {
    const field = writable(ctx, 'create', 'FieldClosure', 'field', fieldId, await fieldRow(tx, fieldId));
    if (field.status === 'retired') throw appError('field/retired', `“${field.name}” is retired: it is not kept or played on, so it is not closed or reopened`);
    const work = await openWork(tx, fieldId, today, input.expectedReopenOn);
    if (work.length && !input.work) {
      const n = work.length;
      throw errors.invalid(`“${field.name}” has ${n} planned work order${n === 1 ? '' : 's'} while closed: choose to keep, move or cancel ${n === 1 ? 'it' : 'them'}`, [
        { path: 'body.work', message: `choose what to do with ${n} planned work order${n === 1 ? '' : 's'}` },
      ]);
    }
    if (work.length && input.work === 'move' && !input.expectedReopenOn) {
      throw errors.invalid('Moving the work needs the day the field is expected to reopen', [{ path: 'body.expectedReopenOn', message: 'give the expected reopening to move the work to' }]);
    }
    const decision: Decision = { status: input.status, reason: input.reason, note: input.note, fromAt, expectedReopenOn: input.expectedReopenOn };
    const recorded = await recordDecision(ctx, tx, field, input.version, decision, { choice: input.work ?? null, count: work.length });
    const done = await settleWork(ctx, tx, field, input, work);
    return { field, decision, recorded, done };
  });
  tellPeople(ctx, deps, result.field, result.decision, result.done.notices);
  const { notices: _notices, ...work } = result.done;
  void _notices;
  return { closure: result.recorded.row, fieldVersion: result.recorded.fieldVersion, work };
}

export async function reopenField(ctx: Ctx, deps: ClosureDeps, fieldId: number, input: ReopenFieldInput): Promise<FieldClosureAnswer<Date>> {
  const result = await (ctx.db as Db).transaction(async (tx) => {
    const field = writable(ctx, 'create', 'FieldClosure', 'field', fieldId, await fieldRow(tx, fieldId));
    if (field.status !== 'closed' && field.status !== 'restricted') {
      throw appError('field/not_closed', `“${field.name}” is ${field.status}, not closed or restricted: there is nothing to reopen`);
    }
    const decision: Decision = { status: 'open', reason: null, note: input.note, fromAt: ctx.clock.now(), expectedReopenOn: null };
    const recorded = await recordDecision(ctx, tx, field, input.version, decision, { choice: null, count: 0 });
    return { field, decision, recorded };
  });
  tellPeople(ctx, deps, result.field, result.decision, []);
  return { closure: result.recorded.row, fieldVersion: result.recorded.fieldVersion, work: { kept: [], moved: [], cancelled: [] } };
}

export type { FieldClosureRow };
