/**
 * Game-day preparation: a booking (the foreman's, or a partner's game request once scheduled)
 * gets a checklist of steps, each made into a work order on the last working days before it.
 * The orders are pinned, so re-generating a week keeps them, and the engine counts them as
 * work done: a kept painting for the booking serves it, a kept cut resets the one-third rule.
 * Work already planned for the booking (the week plan's painting, a cut or a check on those
 * days) is taken into the checklist rather than doubled.
 */
import { and, asc, eq, gte, inArray, lte, ne, notInArray, sql, type SQL } from 'drizzle-orm';
import {
  addDaysIso,
  appError,
  chooseMower,
  colourantHours,
  defaultTemplateFor,
  errors,
  fieldStripePlan,
  GAME_DAY_STEP_LABELS,
  GAME_DAY_STEP_PUBLIC,
  GAME_DAY_STEP_TASK,
  GAME_DAY_STEPS,
  gameDayProgress,
  hocFor,
  levelStandard,
  linePlan,
  LOGO_HOURS,
  mondayOf,
  mowingHours,
  placeGameDaySteps,
  STRIPE_PATTERN_LABELS,
  type CreateGameDayInput,
  type GameDayPrepRow,
  type GameDayStep,
  type Level,
  type PlacedStep,
  type StripePattern,
} from '@swardwise/domain';
import type { Db, Queryable } from '../db/client.ts';
import { crews, fieldEvents, fields, gameDayPreps, sites, workOrders } from '../db/schema/index.ts';
import { writeAudit, type AuditInput } from './audit.ts';
import { authorize, can, type Ctx } from './context.ts';
import { placeScope } from './scope.ts';
import { loadParameters, loadStandards } from './standards.ts';
import { stripePatternsOf } from './stripes.ts';
import { districtCrews, planEquipment, planFieldColumns, siteCrewHints } from './week-plans/load.ts';
import { notifyCrews, workOrderRows, type WorkMoveNotice, type WriteDeps } from './work-orders.ts';

/** The booking with its field, as preparing it needs; 404 when there is none. */
async function eventOf(db: Queryable, eventId: number) {
  const [row] = await db
    .select({
      id: fieldEvents.id,
      title: fieldEvents.title,
      kind: fieldEvents.kind,
      startsOn: fieldEvents.startsOn,
      fieldId: fieldEvents.fieldId,
      siteId: fieldEvents.siteId,
      districtId: fieldEvents.districtId,
      field: {
        id: fields.id,
        name: fields.name,
        ...planFieldColumns,
      },
    })
    .from(fieldEvents)
    .innerJoin(fields, eq(fields.id, fieldEvents.fieldId))
    .where(eq(fieldEvents.id, eventId));
  if (!row) throw errors.notFound('field_event', eventId);
  return row;
}
type EventRow = Awaited<ReturnType<typeof eventOf>>;

/** Who may prepare a booking: checked on the booking's scope before the body is read. */
export async function authorizeGameDay(ctx: Ctx, eventId: number): Promise<void> {
  const e = await eventOf(ctx.db, eventId);
  // A booking the caller may not see is not there for them.
  if (!can(ctx, 'read', 'FieldEvent', { siteId: e.siteId, districtId: e.districtId })) throw errors.notFound('field_event', eventId);
  authorize(ctx, 'create', 'GameDayPrep', { siteId: e.siteId, districtId: e.districtId });
}

/** Hours of each chosen step on this field, as the week plan would plan them. */
async function stepHours(db: Queryable, e: EventRow, steps: readonly GameDayStep[], input: { pattern: StripePattern | null; colourantAreaM2: number | null }) {
  const { standards } = await loadStandards(db);
  const params = await loadParameters(db);
  const level = e.field.maintenanceLevel as Level;
  const hocMm = hocFor({ ...e.field, maintenanceLevel: level }, standards);
  const { mowers } = await planEquipment(db, e.districtId);
  const { spec } = chooseMower(hocMm, mowers, params);
  let mowH = mowingHours(e.field, spec).hours;
  let passes: number | null = null;
  if (input.pattern) {
    try {
      const plan = fieldStripePlan(e.field.geometry, input.pattern, spec);
      passes = plan.passes;
      mowH = Math.max(mowH, plan.hours);
    } catch {
      // An outline the pass plan cannot frame: the plain mowing time stands.
    }
  }
  const std = levelStandard(level, standards);
  const template = defaultTemplateFor(e.field.sport);
  const lp = template ? linePlan(template, params.lines, { days: 1, repaintDays: std.lineRepaintDays ?? 7 }) : null;
  const round = (h: number) => Math.round(h * 100) / 100;
  const hours: Record<GameDayStep, number> = {
    mow: round(mowH),
    colourant: input.colourantAreaM2 ? colourantHours(input.colourantAreaM2) : 0,
    paint_lines: round(lp ? lp.firstCoat.hours : 2),
    logo: LOGO_HOURS,
    field_check: params.planning.fieldCheckHours,
  };
  return { hours, hocMm: Math.round(hocMm * 1000) / 1000, passes, mowerKind: spec.kind, template: template?.name ?? null, lp };
}

/** Open orders of the field around the booking that a step can take over instead of adding one. */
async function adoptable(db: Queryable, e: EventRow, from: string) {
  const taken = await db.select({ steps: gameDayPreps.steps }).from(gameDayPreps).where(eq(gameDayPreps.fieldId, e.fieldId));
  const linked = taken.flatMap((p) => p.steps.map((s) => s.workOrderId)).filter((id): id is number => id !== null);
  const rows = await db
    .select()
    .from(workOrders)
    .where(
      and(
        eq(workOrders.fieldId, e.fieldId),
        inArray(workOrders.task, ['mow', 'paint_lines', 'field_check']),
        inArray(workOrders.status, ['planned', 'assigned']),
        gte(workOrders.plannedDate, from),
        lte(workOrders.plannedDate, e.startsOn),
        linked.length ? notInArray(workOrders.id, linked) : undefined,
      ),
    )
    .orderBy(asc(workOrders.plannedDate), asc(workOrders.id));
  const out = new Map<GameDayStep, (typeof rows)[number]>();
  // The booking's own painting first (the week plan's or a request's), else any painting of those days without another booking.
  const paint = rows.find((r) => r.task === 'paint_lines' && r.details.eventId === e.id) ?? rows.filter((r) => r.task === 'paint_lines' && r.details.eventId === undefined && r.details.gameDayStep === undefined).pop();
  if (paint) out.set('paint_lines', paint);
  const mow = rows.filter((r) => r.task === 'mow' && r.plannedDate < e.startsOn).pop();
  if (mow) out.set('mow', mow);
  const check = rows.filter((r) => r.task === 'field_check' && r.plannedDate < e.startsOn).pop();
  if (check) out.set('field_check', check);
  return out;
}

/** Hours already on each crew-day of the district in the days before the booking, key `${crewId}|${date}`. */
async function crewLoad(db: Queryable, districtId: number, from: string, to: string, leaveOut: readonly number[]) {
  const rows = await db
    .select({ crewId: workOrders.crewId, date: workOrders.plannedDate, hours: sql<number>`sum(${workOrders.plannedHours})`.mapWith(Number) })
    .from(workOrders)
    .where(and(eq(workOrders.districtId, districtId), gte(workOrders.plannedDate, from), lte(workOrders.plannedDate, to), ne(workOrders.status, 'skipped'), sql`${workOrders.crewId} is not null`, leaveOut.length ? notInArray(workOrders.id, [...leaveOut]) : undefined))
    .groupBy(workOrders.crewId, workOrders.plannedDate);
  return new Map(rows.map((r) => [`${r.crewId}|${r.date}`, r.hours]));
}

/**
 * Prepares a booking for its day: the checklist of the chosen steps, each a pinned work order
 * on the last working days before the booking within the crews' hours. 409 when the booking
 * has one already; 400 for a booking already past.
 */
export async function createGameDayPrep(ctx: Ctx, eventId: number, input: CreateGameDayInput, deps: WriteDeps): Promise<{ gameDay: GameDayPrepRow<Date>; emailed: number }> {
  const today = ctx.clock.today();
  const prepId = await (ctx.db as Db).transaction(async (tx) => {
    const e = await eventOf(tx, eventId);
    authorize(ctx, 'create', 'GameDayPrep', { siteId: e.siteId, districtId: e.districtId });
    if (e.startsOn < today) throw appError('game_day/past_event', `The event on ${e.startsOn} has passed; prepare an event from today on`);
    if (e.field.status === 'retired') throw appError('field/retired', 'The field is retired: it is not kept any more');
    const [existing] = await tx.select({ id: gameDayPreps.id }).from(gameDayPreps).where(eq(gameDayPreps.eventId, eventId));
    if (existing) throw appError('game_day/exists', 'This event has a game-day preparation already; open it to follow or change its work');

    const pattern = input.pattern !== undefined ? input.pattern : ((await stripePatternsOf(tx, [e.fieldId])).get(e.fieldId)?.pattern ?? null);
    const steps = GAME_DAY_STEPS.filter((s) => input.steps.includes(s));
    const facts = await stepHours(tx, e, steps, { pattern, colourantAreaM2: input.colourant?.areaM2 ?? null });
    const from = today > addDaysIso(e.startsOn, -7) ? today : addDaysIso(e.startsOn, -7);
    const adopt = await adoptable(tx, e, from);
    const crewRows = await districtCrews(tx, e.districtId);
    const hints = await siteCrewHints(tx, { districtId: e.districtId, weekStart: mondayOf(from) }, e.startsOn);
    const load = await crewLoad(tx, e.districtId, from, e.startsOn, [...adopt.values()].map((o) => o.id));
    const placed = placeGameDaySteps({
      eventOn: e.startsOn,
      notBefore: today,
      steps: steps.map((step) => ({ step, hours: adopt.get(step)?.plannedHours ?? facts.hours[step] })),
      crews: crewRows.map((c) => ({ id: c.id, hoursPerDay: c.hoursPerDay, workDays: c.workDays })),
      load,
      siteCrewId: hints.get(e.siteId) ?? null,
    });

    const [prep] = await tx
      .insert(gameDayPreps)
      .values({ fieldId: e.fieldId, siteId: e.siteId, districtId: e.districtId, eventId, steps: [], colourant: input.colourant, pattern, createdBy: ctx.actor.id })
      .returning();
    const audits: AuditInput[] = [];
    const stepRows: { step: GameDayStep; workOrderId: number | null }[] = [];
    for (const p of placed) {
      const details = stepDetails(p.step, e, prep!.id, facts, pattern, input.colourant);
      const reason = stepReason(p, e);
      const before = adopt.get(p.step);
      if (before) {
        const [after] = await tx
          .update(workOrders)
          .set({
            plannedDate: p.date,
            weekStart: mondayOf(p.date),
            crewId: p.crewId ?? before.crewId,
            status: (p.crewId ?? before.crewId) ? 'assigned' : 'planned',
            pinned: true,
            reason,
            details: { ...before.details, ...details },
            version: sql`${workOrders.version} + 1`,
            updatedAt: new Date(),
          })
          .where(eq(workOrders.id, before.id))
          .returning();
        audits.push({ actorId: ctx.actor.id, action: 'update', entity: 'work_order', entityId: before.id, districtId: e.districtId, before, after: after! });
        stepRows.push({ step: p.step, workOrderId: before.id });
        continue;
      }
      const [row] = await tx
        .insert(workOrders)
        .values({
          fieldId: e.fieldId,
          siteId: e.siteId,
          districtId: e.districtId,
          task: GAME_DAY_STEP_TASK[p.step],
          weekStart: mondayOf(p.date),
          plannedDate: p.date,
          crewId: p.crewId,
          plannedHours: p.hours,
          status: p.crewId ? 'assigned' : 'planned',
          origin: 'manual',
          pinned: true,
          reason,
          details,
          createdBy: ctx.actor.id,
        })
        .returning();
      audits.push({ actorId: ctx.actor.id, action: 'create', entity: 'work_order', entityId: row!.id, districtId: e.districtId, before: null, after: row! });
      stepRows.push({ step: p.step, workOrderId: row!.id });
    }
    const [saved] = await tx.update(gameDayPreps).set({ steps: stepRows }).where(eq(gameDayPreps.id, prep!.id)).returning();
    audits.push({ actorId: ctx.actor.id, action: 'create', entity: 'game_day', entityId: prep!.id, districtId: e.districtId, before: null, after: { ...saved!, notes: placementNotes(placed) } });
    await writeAudit(tx, audits);
    return prep!.id;
  });
  const [row] = await gameDayRows(ctx, eq(gameDayPreps.id, prepId));
  // Each crew lead hears of the jobs given to the crew, as with any assigned work.
  const orders = await workOrderRows(ctx.db, row!.steps.map((s) => s.workOrderId).filter((id): id is number => id !== null));
  const byCrew = new Map<number, WorkMoveNotice['orders']>();
  for (const o of orders) if (o.crewId !== null) byCrew.set(o.crewId, [...(byCrew.get(o.crewId) ?? []), o]);
  const emailed = byCrew.size ? await notifyCrews(ctx.db, deps.mailer, [...byCrew].map(([crewId, list]) => ({ crewId, kind: 'assigned' as const, orders: list })), ctx.actorName, deps.publicUrl) : 0;
  return { gameDay: row!, emailed };
}

/** What the order carries for the crew: the booking, and per step its HOC and pattern, paint, colourant or logo. */
function stepDetails(step: GameDayStep, e: EventRow, prepId: number, facts: Awaited<ReturnType<typeof stepHours>>, pattern: StripePattern | null, colourant: CreateGameDayInput['colourant']): Record<string, unknown> {
  const base = { gameDayPrepId: prepId, gameDayStep: step, eventTitle: e.title, eventOn: e.startsOn };
  switch (step) {
    case 'mow':
      return { ...base, hocMm: facts.hocMm, mowerKind: facts.mowerKind, ...(pattern ? { pattern, ...(facts.passes ? { passes: facts.passes } : {}) } : {}) };
    case 'paint_lines':
      // The booking's id: the week plan counts this painting as the one for the booking.
      return { ...base, eventId: e.id, ...(facts.lp && facts.template ? { template: facts.template, lineLengthM: Math.round(facts.lp.lineLengthM), paintL: Math.round(facts.lp.firstCoat.concentrateLitres * 10) / 10 } : {}) };
    case 'logo':
      return { ...base, logo: true };
    case 'colourant':
      return { ...base, colourant };
    case 'field_check':
      return base;
  }
}

function stepReason(p: PlacedStep, e: EventRow): string {
  const why = `Game-day preparation for ${e.title} on ${e.startsOn}: ${GAME_DAY_STEP_LABELS[p.step].toLowerCase()}`;
  if (p.onEventDay) return `${why} (no working day left before it: on the day)`;
  if (p.overHours) return `${why} (no crew had room in the days before: over the crew's hours)`;
  return why;
}

function placementNotes(placed: readonly PlacedStep[]): string[] {
  return placed.flatMap((p) => (p.onEventDay ? [`${GAME_DAY_STEP_LABELS[p.step]} falls on the event day: no working day is left before it.`] : p.overHours ? [`${GAME_DAY_STEP_LABELS[p.step]} on ${p.date} goes over the crew's hours: no crew had room in the days before.`] : []));
}

/** The preparations matching `where` the caller may read, with their orders' progress; a partner's without hours or crews. */
async function gameDayRows(ctx: Ctx, where: SQL | undefined): Promise<GameDayPrepRow<Date>[]> {
  const preps = await ctx.db
    .select({
      prep: gameDayPreps,
      eventTitle: fieldEvents.title,
      eventKind: fieldEvents.kind,
      eventOn: fieldEvents.startsOn,
      eventTime: fieldEvents.startTime,
      fieldName: fields.name,
      siteName: sites.name,
    })
    .from(gameDayPreps)
    .innerJoin(fieldEvents, eq(fieldEvents.id, gameDayPreps.eventId))
    .innerJoin(fields, eq(fields.id, gameDayPreps.fieldId))
    .innerJoin(sites, eq(sites.id, gameDayPreps.siteId))
    .where(and(placeScope(ctx.actor, gameDayPreps.districtId, gameDayPreps.siteId), where))
    .orderBy(asc(fieldEvents.startsOn), asc(gameDayPreps.id));
  const visible = preps.filter((p) => can(ctx, 'read', 'GameDayPrep', p.prep));
  const ids = visible.flatMap((p) => p.prep.steps.map((s) => s.workOrderId)).filter((id): id is number => id !== null);
  const orders = ids.length
    ? await ctx.db
        .select({ id: workOrders.id, plannedDate: workOrders.plannedDate, status: workOrders.status, plannedHours: workOrders.plannedHours, doneAt: workOrders.doneAt, crewName: crews.name })
        .from(workOrders)
        .leftJoin(crews, eq(crews.id, workOrders.crewId))
        .where(inArray(workOrders.id, ids))
    : [];
  const byId = new Map(orders.map((o) => [o.id, o]));
  const staff = ctx.actor.role !== 'partner';
  return visible.map(({ prep, ...e }) => {
    const steps = prep.steps.map((s) => {
      const o = s.workOrderId === null ? undefined : byId.get(s.workOrderId);
      const status = o?.status ?? 'planned';
      return {
        step: s.step,
        label: GAME_DAY_STEP_LABELS[s.step],
        publicLabel: GAME_DAY_STEP_PUBLIC[s.step],
        workOrderId: staff && o ? o.id : null,
        plannedDate: o?.plannedDate ?? null,
        status,
        done: status === 'done',
        crewName: staff ? (o?.crewName ?? null) : null,
        plannedHours: staff ? (o?.plannedHours ?? null) : null,
        doneAt: o?.doneAt ? o.doneAt.toISOString() : null,
      };
    });
    const onDay = steps.filter((s) => s.plannedDate !== null && s.plannedDate >= e.eventOn && s.status !== 'done');
    return {
      id: prep.id,
      eventId: prep.eventId,
      eventTitle: e.eventTitle,
      eventKind: e.eventKind,
      eventOn: e.eventOn,
      eventTime: e.eventTime,
      fieldId: prep.fieldId,
      fieldName: e.fieldName,
      siteId: prep.siteId,
      siteName: e.siteName,
      districtId: prep.districtId,
      pattern: prep.pattern,
      colourant: prep.colourant,
      steps,
      progress: gameDayProgress(steps.map((s) => s.status)),
      notes: staff ? onDay.map((s) => `${s.label} is planned on the event day.`) : [],
      version: prep.version,
      createdAt: prep.createdAt,
    };
  });
}

export interface GameDayFilter {
  from: string;
  to: string;
  fieldId?: number | undefined;
  districtId?: number | undefined;
}

export async function listGameDays(ctx: Ctx, filter: GameDayFilter): Promise<GameDayPrepRow<Date>[]> {
  authorize(ctx, 'read', 'GameDayPrep');
  return gameDayRows(
    ctx,
    and(
      gte(fieldEvents.startsOn, filter.from),
      lte(fieldEvents.startsOn, filter.to),
      filter.fieldId ? eq(gameDayPreps.fieldId, filter.fieldId) : undefined,
      filter.districtId ? eq(gameDayPreps.districtId, filter.districtId) : undefined,
    ),
  );
}

export async function getGameDay(ctx: Ctx, id: number): Promise<GameDayPrepRow<Date>> {
  authorize(ctx, 'read', 'GameDayPrep');
  const [row] = await gameDayRows(ctx, eq(gameDayPreps.id, id));
  if (!row) throw errors.notFound('game_day', id);
  return row;
}

/** The pattern's words for the checklist (null: plain mowing). */
export const patternWords = (p: StripePattern | null) => (p ? STRIPE_PATTERN_LABELS[p] : 'Plain mowing');
