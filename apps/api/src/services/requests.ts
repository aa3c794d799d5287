/**
 * Partners' requests: a school athletic director or a league contact asks for lines for a
 * game, or reports a wet area, damaged turf or a safety concern, with photos. The district's
 * foreman answers in the request's thread and decides: a game request becomes a booking of
 * the field (the week plan paints lines on the last working day before it), any other kind
 * becomes one work order; or he declines it with a reason. The request is done when its work
 * is done, or when the foreman closes it. Every step is audited, and e-mailed after the
 * commit: filed and replied to the district's foremen, the rest to the partner who filed it.
 */
import { randomUUID } from 'node:crypto';
import { and, asc, desc, eq, or, sql, type SQL } from 'drizzle-orm';
import {
  addDaysIso,
  appError,
  errors,
  layoutsForSport,
  LINE_LAYOUTS,
  mondayOf,
  REQUEST_KIND_LABELS,
  SPORT_LABELS,
  WORK_TASK_LABELS,
  type CloseFieldRequestInput,
  type CreateFieldRequestInput,
  type DeclineFieldRequestInput,
  type FieldRequestDetail,
  type FieldRequestPhotoAnswer,
  type FieldRequestRow,
  type FieldRequestWork,
  type RequestListQuery,
  type RequestMessageInput,
  type RequestState,
  type ScheduleFieldRequestInput,
  type Sport,
  type UpdateFieldRequestInput,
} from '@swardwise/domain';
import type { Db, Queryable } from '../db/client.ts';
import { crews, fieldEvents, fieldRequestMessages, fieldRequestPhotos, fieldRequests, fields, sites, users, workOrders } from '../db/schema/index.ts';
import type { Mailer } from '../mail/mailer.ts';
import { requestMail, type RequestStep } from '../mail/messages.ts';
import type { BackgroundTasks } from './background.ts';
import { writeAudit } from './audit.ts';
import { authorize, can, type Ctx } from './context.ts';
import { onFieldJoins, placeScope } from './scope.ts';
import { auditedRow, updateAtVersion } from './versioned.ts';
import { PHOTO_MAX_BYTES, photoFileName, storePhoto, storedPhotoAnswer, storedPhotoPath } from './work-photos.ts';

export { PHOTO_MAX_BYTES as REQUEST_PHOTO_MAX_BYTES };
/** Enough to show a wet patch or a broken sprinkler head from a few sides. */
export const PHOTOS_PER_REQUEST = 6;
const LIST_LIMIT = 500;

export interface RequestDeps {
  mailer: Mailer;
  publicUrl: string;
  background: BackgroundTasks;
}

/** A request as its own row has it; the partner's page reads these too. */
export const requestFacts = {
  kind: fieldRequests.kind,
  gameOn: fieldRequests.gameOn,
  startTime: fieldRequests.startTime,
  layout: fieldRequests.layout,
  description: fieldRequests.description,
  state: fieldRequests.state,
  reason: fieldRequests.reason,
};

const columns = {
  id: fieldRequests.id,
  fieldId: fieldRequests.fieldId,
  fieldName: fields.name,
  sport: fields.sport,
  siteId: fieldRequests.siteId,
  siteName: sites.name,
  districtId: fieldRequests.districtId,
  ...requestFacts,
  eventId: fieldRequests.eventId,
  workOrderId: fieldRequests.workOrderId,
  createdBy: fieldRequests.createdBy,
  createdByName: users.name,
  photoCount: sql<number>`(select count(*)::int from ${fieldRequestPhotos} p where p.request_id = ${fieldRequests.id})`,
  messageCount: sql<number>`(select count(*)::int from ${fieldRequestMessages} m where m.request_id = ${fieldRequests.id})`,
  version: fieldRequests.version,
  createdAt: fieldRequests.createdAt,
  updatedAt: fieldRequests.updatedAt,
};

function select(db: Queryable) {
  return onFieldJoins(db.select(columns).from(fieldRequests).$dynamic(), { fieldId: fieldRequests.fieldId, siteId: fieldRequests.siteId, by: fieldRequests.createdBy });
}

type Row = Awaited<ReturnType<typeof rowOf>> & {};

async function rowOf(db: Queryable, id: number) {
  const [row] = await select(db).where(eq(fieldRequests.id, id));
  return row;
}

function answer(row: NonNullable<Row>): FieldRequestRow<Date> {
  const { sport: _sport, ...rest } = row;
  void _sport;
  return rest;
}

/** The request if the caller may read it; 404 otherwise, so ids of other schools' requests tell nothing. */
function readable(ctx: Ctx, id: number, row: Row | undefined): NonNullable<Row> {
  if (!row || !can(ctx, 'read', 'Request', row)) throw errors.notFound('field_request', id);
  return row;
}

/** The request for a change: 404 when the caller may not read it, 403 when he may read but not `action` it. */
function changeable(ctx: Ctx, action: 'update' | 'assign', id: number, row: Row | undefined): NonNullable<Row> {
  const r = readable(ctx, id, row);
  authorize(ctx, action, 'Request', r);
  return r;
}

/** Checks the caller may `action` request `id` (404 / 403), for a route to call before it reads an upload. */
export async function requestFor(ctx: Ctx, id: number, action: 'update' | 'assign'): Promise<void> {
  changeable(ctx, action, id, await rowOf(ctx.db, id));
}

function mustBe(row: NonNullable<Row>, states: RequestState[], doing: string) {
  if (!states.includes(row.state)) throw appError('field_request/not_open', `Request #${row.id} is ${row.state}: it cannot be ${doing}`);
}

export async function listRequests(ctx: Ctx, query: RequestListQuery): Promise<FieldRequestRow<Date>[]> {
  authorize(ctx, 'read', 'Request');
  const conditions: (SQL | undefined)[] = [placeScope(ctx.actor, fieldRequests.districtId, fieldRequests.siteId)];
  if (query.state) conditions.push(eq(fieldRequests.state, query.state));
  const rows = await select(ctx.db)
    .where(and(...conditions))
    .orderBy(sql`case ${fieldRequests.state} when 'requested' then 0 when 'scheduled' then 1 else 2 end`, desc(fieldRequests.createdAt), desc(fieldRequests.id))
    .limit(LIST_LIMIT);
  return rows.filter((r) => can(ctx, 'read', 'Request', r)).map(answer);
}

const photoUrl = (requestId: number, photoId: number) => `/api/requests/${requestId}/photos/${photoId}`;

/** Work the request became: its one-off order, or the paintings the week plan made for its booking. */
async function workOf(db: Queryable, row: { workOrderId: number | null; eventId: number | null }): Promise<FieldRequestWork[]> {
  const links: SQL[] = [];
  if (row.workOrderId !== null) links.push(eq(workOrders.id, row.workOrderId));
  if (row.eventId !== null) links.push(and(eq(workOrders.task, 'paint_lines'), sql`${workOrders.details}->>'eventId' = ${String(row.eventId)}`)!);
  if (!links.length) return [];
  return db
    .select({ id: workOrders.id, task: workOrders.task, plannedDate: workOrders.plannedDate, status: workOrders.status })
    .from(workOrders)
    .where(or(...links))
    .orderBy(asc(workOrders.plannedDate), asc(workOrders.id));
}

export async function getRequest(ctx: Ctx, id: number): Promise<FieldRequestDetail<Date>> {
  const row = readable(ctx, id, await rowOf(ctx.db, id));
  const [messages, photos, work] = await Promise.all([
    ctx.db
      .select({ id: fieldRequestMessages.id, authorId: fieldRequestMessages.authorId, authorName: users.name, authorRole: users.role, body: fieldRequestMessages.body, createdAt: fieldRequestMessages.createdAt })
      .from(fieldRequestMessages)
      .leftJoin(users, eq(users.id, fieldRequestMessages.authorId))
      .where(eq(fieldRequestMessages.requestId, id))
      .orderBy(asc(fieldRequestMessages.createdAt), asc(fieldRequestMessages.id)),
    ctx.db.select().from(fieldRequestPhotos).where(eq(fieldRequestPhotos.requestId, id)).orderBy(asc(fieldRequestPhotos.id)),
    workOf(ctx.db, row),
  ]);
  return {
    request: answer(row),
    messages,
    photos: photos.map((p) => storedPhotoAnswer(p, photoUrl(id, p.id))),
    work,
  };
}

/** The field a request is about, with its scope; 400 when there is none. */
async function fieldOf(db: Queryable, fieldId: number) {
  const [field] = await db
    .select({ id: fields.id, name: fields.name, sport: fields.sport, status: fields.status, siteId: fields.siteId, districtId: sites.districtId })
    .from(fields)
    .innerJoin(sites, eq(sites.id, fields.siteId))
    .where(eq(fields.id, fieldId));
  if (!field) throw errors.noSuch('field', 'body.fieldId');
  return field;
}

/** A game's day from today on, and a layout that fits the field. */
function checkGame(ctx: Ctx, sport: Sport, game: { gameOn: string | null; layout: string | null }) {
  if (game.gameOn !== null && game.gameOn < ctx.clock.today()) {
    throw appError('field_request/past_game', 'The game’s day has passed; give a day from today on', { issues: [{ path: 'body.gameOn', message: `must be ${ctx.clock.today()} or later` }] });
  }
  if (game.layout !== null && !layoutsForSport(sport).includes(game.layout as never)) {
    throw appError('field_request/layout', `A ${LINE_LAYOUTS[game.layout as keyof typeof LINE_LAYOUTS].name} layout does not go on a ${SPORT_LABELS[sport].toLowerCase()} field`, {
      issues: [{ path: 'body.layout', message: `choose one of ${layoutsForSport(sport).join(', ')}` }],
    });
  }
}

export async function createRequest(ctx: Ctx, deps: RequestDeps, input: CreateFieldRequestInput): Promise<FieldRequestRow<Date>> {
  const game = input.kind === 'game_lines';
  const row = await (ctx.db as Db).transaction(async (tx) => {
    const field = await fieldOf(tx, input.fieldId);
    // A partner names only fields of his own sites; the same 403 whether the id was guessed or not.
    authorize(ctx, 'create', 'Request', { siteId: field.siteId, districtId: field.districtId });
    const values = { gameOn: game ? input.gameOn : null, startTime: game ? input.startTime : null, layout: game ? input.layout : null };
    checkGame(ctx, field.sport, values);
    const [created] = await tx
      .insert(fieldRequests)
      .values({ fieldId: field.id, siteId: field.siteId, districtId: field.districtId, kind: input.kind, ...values, layout: values.layout as never, description: input.description, createdBy: ctx.actor.id })
      .returning({ id: fieldRequests.id });
    return auditedRow(ctx, tx, 'field_request', null, created!.id, rowOf);
  });
  tell(ctx, deps, row, 'filed', row.description);
  return answer(row);
}

export async function updateRequest(ctx: Ctx, id: number, input: UpdateFieldRequestInput): Promise<FieldRequestRow<Date>> {
  return (ctx.db as Db).transaction(async (tx) => {
    const before = changeable(ctx, 'update', id, await rowOf(tx, id));
    // The request is the partner's own words: the foreman answers, schedules or declines it, but does not rewrite it.
    if (before.createdBy !== ctx.actor.id) throw errors.forbidden('Only the partner who filed a request can change it; answer it with a message instead');
    mustBe(before, ['requested'], 'changed once the foreman has decided it');
    const { version, ...changes } = input;
    const game = before.kind === 'game_lines';
    if (!game && (changes.gameOn != null || changes.layout != null || changes.startTime != null)) {
      throw errors.invalid('Only a game request has a day, a time and a layout', [{ path: 'body.gameOn', message: 'only for lines for a game' }]);
    }
    const next = { gameOn: changes.gameOn !== undefined ? changes.gameOn : before.gameOn, layout: changes.layout !== undefined ? changes.layout : before.layout };
    if (game && (!next.gameOn || !next.layout)) {
      throw errors.invalid('A game request needs its day and layout', [{ path: next.gameOn ? 'body.layout' : 'body.gameOn', message: next.gameOn ? 'choose the layout to paint' : 'give the date of the game' }]);
    }
    if (game) checkGame(ctx, before.sport, next);
    await updateAtVersion(tx, fieldRequests, 'field_request', id, version, { ...changes, layout: changes.layout as never });
    return answer(await auditedRow(ctx, tx, 'field_request', before, id, rowOf));
  });
}

/**
 * A message in the request's thread. The foreman's is an answer, e-mailed to the partner who
 * filed; the partner's is a reply, e-mailed to the district's foremen. Adding one does not
 * change the request's version: a message never overwrites anything.
 */
export async function addMessage(ctx: Ctx, deps: RequestDeps, id: number, input: RequestMessageInput): Promise<FieldRequestDetail<Date>> {
  const row = await (ctx.db as Db).transaction(async (tx) => {
    const row = changeable(ctx, 'update', id, await rowOf(tx, id));
    const [message] = await tx.insert(fieldRequestMessages).values({ requestId: id, authorId: ctx.actor.id, body: input.body }).returning();
    await tx.update(fieldRequests).set({ updatedAt: new Date() }).where(eq(fieldRequests.id, id));
    await writeAudit(tx, { actorId: ctx.actor.id, action: 'create', entity: 'field_request_message', entityId: message!.id, districtId: row.districtId, before: null, after: message! });
    return row;
  });
  tell(ctx, deps, row, ctx.actor.id === row.createdBy ? 'replied' : 'answered', input.body);
  return getRequest(ctx, id);
}

async function checkCrew(db: Queryable, districtId: number, crewId: number | null) {
  if (crewId === null) return;
  const [c] = await db.select({ districtId: crews.districtId }).from(crews).where(eq(crews.id, crewId));
  if (!c) throw errors.noSuch('crew', 'body.work.crewId');
  if (c.districtId !== districtId) throw errors.invalid('This crew works in another district', [{ path: 'body.work.crewId', message: 'this crew works in another district' }]);
}

/** The foreman turns the request into work: a booking for a game, one work order for the rest. */
export async function scheduleRequest(ctx: Ctx, deps: RequestDeps, id: number, input: ScheduleFieldRequestInput): Promise<FieldRequestRow<Date>> {
  let workWords = '';
  const after = await (ctx.db as Db).transaction(async (tx) => {
    const before = changeable(ctx, 'assign', id, await rowOf(tx, id));
    mustBe(before, ['requested'], 'scheduled');
    const link: { eventId?: number; workOrderId?: number } = {};
    if (before.kind === 'game_lines') {
      if (input.work) throw errors.invalid('A game request is planned by the week plan through its booking; leave out the work order', [{ path: 'body.work', message: 'not for a game request' }]);
      if (before.gameOn! < ctx.clock.today()) throw appError('field_request/past_game', 'The game’s day has passed; decline or close the request instead');
      const layout = before.layout ? LINE_LAYOUTS[before.layout].name : 'lines';
      const [event] = await tx
        .insert(fieldEvents)
        .values({
          fieldId: before.fieldId,
          siteId: before.siteId,
          districtId: before.districtId,
          kind: 'game',
          title: `Game (${layout})`,
          startsOn: before.gameOn!,
          startTime: before.startTime,
          notes: `From request #${id}`,
          createdBy: ctx.actor.id,
        })
        .returning();
      await writeAudit(tx, { actorId: ctx.actor.id, action: 'create', entity: 'field_event', entityId: event!.id, districtId: before.districtId, before: null, after: event! });
      link.eventId = event!.id;
      workWords = `The game is booked on the field; the ${layout} lines are painted on the last working day before it (the week plan of ${mondayOf(addDaysIso(before.gameOn!, -1))} plans it).`;
    } else {
      if (!input.work) throw errors.invalid('Say what work the request becomes: task, day, hours and crew', [{ path: 'body.work', message: 'give the work order' }]);
      const work = input.work;
      if (work.plannedDate < ctx.clock.today()) throw errors.invalid('The work is planned from today on', [{ path: 'body.work.plannedDate', message: `must be ${ctx.clock.today()} or later` }]);
      await checkCrew(tx, before.districtId, work.crewId);
      const [order] = await tx
        .insert(workOrders)
        .values({
          fieldId: before.fieldId,
          siteId: before.siteId,
          districtId: before.districtId,
          task: work.task,
          weekStart: mondayOf(work.plannedDate),
          plannedDate: work.plannedDate,
          crewId: work.crewId,
          plannedHours: work.plannedHours,
          status: work.crewId ? 'assigned' : 'planned',
          origin: 'manual',
          pinned: true,
          reason: `Request #${id}: ${REQUEST_KIND_LABELS[before.kind].toLowerCase()}`,
          details: { requestId: id },
          notes: before.description,
          createdBy: ctx.actor.id,
        })
        .returning();
      await writeAudit(tx, { actorId: ctx.actor.id, action: 'create', entity: 'work_order', entityId: order!.id, districtId: before.districtId, before: null, after: order! });
      link.workOrderId = order!.id;
      workWords = `Planned: ${WORK_TASK_LABELS[work.task]} on ${work.plannedDate}.`;
    }
    await updateAtVersion(tx, fieldRequests, 'field_request', id, input.version, { state: 'scheduled', reason: input.note, decidedBy: ctx.actor.id, scheduledAt: ctx.clock.now(), ...link });
    return auditedRow(ctx, tx, 'field_request', before, id, rowOf);
  });
  tell(ctx, deps, after, 'scheduled', input.note, workWords);
  return answer(after);
}

export async function declineRequest(ctx: Ctx, deps: RequestDeps, id: number, input: DeclineFieldRequestInput): Promise<FieldRequestRow<Date>> {
  const after = await (ctx.db as Db).transaction(async (tx) => {
    const before = changeable(ctx, 'assign', id, await rowOf(tx, id));
    mustBe(before, ['requested'], 'declined');
    await updateAtVersion(tx, fieldRequests, 'field_request', id, input.version, { state: 'declined', reason: input.reason, decidedBy: ctx.actor.id, closedAt: ctx.clock.now() });
    return auditedRow(ctx, tx, 'field_request', before, id, rowOf);
  });
  tell(ctx, deps, after, 'declined', input.reason);
  return answer(after);
}

/** The foreman closes a request as done (its work done another way, or nothing more to do). */
export async function closeRequest(ctx: Ctx, deps: RequestDeps, id: number, input: CloseFieldRequestInput): Promise<FieldRequestRow<Date>> {
  const after = await (ctx.db as Db).transaction(async (tx) => {
    const before = changeable(ctx, 'assign', id, await rowOf(tx, id));
    mustBe(before, ['requested', 'scheduled'], 'closed');
    await updateAtVersion(tx, fieldRequests, 'field_request', id, input.version, { state: 'done', reason: input.note || before.reason, decidedBy: ctx.actor.id, closedAt: ctx.clock.now() });
    return auditedRow(ctx, tx, 'field_request', before, id, rowOf);
  });
  tell(ctx, deps, after, 'done', input.note);
  return answer(after);
}

/**
 * After a work order is logged done: the scheduled requests it was for are done when all
 * their work is (a skipped order does not count either way). Runs as the crew lead who logged
 * it; the request's own abilities are not his, the consequence is the department's.
 */
export async function finishRequestsOf(ctx: Ctx, deps: RequestDeps, orderId: number): Promise<number[]> {
  return moveRequestsOf(ctx, deps, orderId, {
    orderStatus: 'done',
    from: 'scheduled',
    to: 'done',
    ready: async (tx, before) => {
      const work = (await workOf(tx, before)).filter((w) => w.status !== 'skipped');
      return work.length > 0 && work.every((w) => w.status === 'done');
    },
    note: 'The work is done.',
  });
}

/**
 * Moves the requests order `orderId` was made for from state `from` to `to` (done is closed at
 * the department's now, scheduled is open again), each in its own transaction with its audit
 * entry; `ready` may hold one back. The partners are told once all are written.
 */
async function moveRequestsOf(
  ctx: Ctx,
  deps: RequestDeps,
  orderId: number,
  move: { orderStatus: 'done' | 'open'; from: RequestState; to: 'done' | 'scheduled'; ready?: (tx: Queryable, before: NonNullable<Row>) => Promise<boolean>; note: string },
): Promise<number[]> {
  const candidates = await requestsOfOrder(ctx.db, orderId, move.orderStatus, move.from);
  const moved: NonNullable<Row>[] = [];
  for (const { id } of candidates) {
    const after = await (ctx.db as Db).transaction(async (tx) => {
      const before = await rowOf(tx, id);
      if (!before || before.state !== move.from) return null;
      if (move.ready && !(await move.ready(tx, before))) return null;
      const closedAt = move.to === 'done' ? ctx.clock.now() : null;
      await tx.update(fieldRequests).set({ state: move.to, closedAt, version: sql`${fieldRequests.version} + 1`, updatedAt: new Date() }).where(eq(fieldRequests.id, id));
      return auditedRow(ctx, tx, 'field_request', before, id, rowOf);
    });
    if (after) moved.push(after);
  }
  for (const row of moved) tell(ctx, deps, row, move.to, move.note);
  return moved.map((r) => r.id);
}

/** The requests in `state` that order `orderId` was made for (its own, or its event's), when the order is `orderStatus`. */
async function requestsOfOrder(db: Queryable, orderId: number, orderStatus: 'done' | 'open', state: RequestState) {
  const [order] = await db.select({ id: workOrders.id, status: workOrders.status, details: workOrders.details }).from(workOrders).where(eq(workOrders.id, orderId));
  if (!order) return [];
  const finished = order.status === 'done' || order.status === 'skipped';
  if (orderStatus === 'done' ? order.status !== 'done' : finished) return [];
  const eventId = Number(order.details?.eventId);
  const links: SQL[] = [eq(fieldRequests.workOrderId, orderId)];
  if (Number.isInteger(eventId) && eventId > 0) links.push(eq(fieldRequests.eventId, eventId));
  return db.select({ id: fieldRequests.id }).from(fieldRequests).where(and(eq(fieldRequests.state, state), or(...links)));
}

/**
 * After a work order is reopened: a request it had finished is scheduled again, since its work
 * is open once more, and the partner who filed it is told. Runs as whoever reopened the order,
 * as `finishRequestsOf` does.
 */
export async function reopenRequestsOf(ctx: Ctx, deps: RequestDeps, orderId: number): Promise<number[]> {
  return moveRequestsOf(ctx, deps, orderId, {
    orderStatus: 'open',
    from: 'done',
    to: 'scheduled',
    note: 'The work was reopened: the request is scheduled again until it is done.',
  });
}

/** The people a step is e-mailed to: the district's foremen for a new request or a reply, else the partner who filed it. */
async function recipients(db: Queryable, row: NonNullable<Row>, step: RequestStep) {
  const active = eq(users.active, true);
  if (step === 'filed' || step === 'replied') {
    return db.select({ email: users.email, name: users.name }).from(users).where(and(eq(users.role, 'foreman'), eq(users.districtId, row.districtId), active));
  }
  if (row.createdBy === null) return [];
  return db.select({ email: users.email, name: users.name }).from(users).where(and(eq(users.id, row.createdBy), active));
}

/** After the commit; a failed e-mail never undoes the step. */
function tell(ctx: Ctx, deps: RequestDeps, row: NonNullable<Row>, step: RequestStep, text: string, work: string | null = null) {
  deps.background.run('request e-mail', async () => {
    const notice = {
      id: row.id,
      step,
      kind: REQUEST_KIND_LABELS[row.kind],
      fieldName: row.fieldName,
      siteName: row.siteName,
      gameOn: row.gameOn,
      layout: row.layout ? LINE_LAYOUTS[row.layout].name : null,
      text,
      byName: ctx.actorName,
      work,
    };
    for (const r of await recipients(ctx.db, row, step)) await deps.mailer.send(requestMail(r.email, r.name, notice, deps.publicUrl));
  });
}

/** A photo the partner who filed the request adds while it is open; decoded and re-encoded as the crews' photos are. */
export async function addRequestPhoto(ctx: Ctx, id: number, buffer: Buffer, uploadsDir: string): Promise<FieldRequestPhotoAnswer<Date>> {
  const row = changeable(ctx, 'update', id, await rowOf(ctx.db, id));
  mustBe(row, ['requested', 'scheduled'], 'given photos');
  const fileName = photoFileName(`rq${id}`, randomUUID());
  const { row: photo } = await storePhoto<typeof fieldRequestPhotos.$inferSelect>(ctx, uploadsDir, fileName, buffer, {
    table: fieldRequestPhotos,
    key: { requestId: id },
    name: 'request',
    limit: PHOTOS_PER_REQUEST,
    entity: 'field_request_photo',
    districtId: row.districtId,
    code: 'request_photo',
  });
  return { photo: storedPhotoAnswer(photo, photoUrl(id, photo.id)) };
}

export async function requestPhotoFile(ctx: Ctx, id: number, photoId: number, uploadsDir: string) {
  readable(ctx, id, await rowOf(ctx.db, id));
  const [photo] = await ctx.db
    .select({ fileName: fieldRequestPhotos.fileName, mime: fieldRequestPhotos.mime })
    .from(fieldRequestPhotos)
    .where(and(eq(fieldRequestPhotos.id, photoId), eq(fieldRequestPhotos.requestId, id)));
  if (!photo) throw errors.notFound('request_photo', photoId);
  return { file: await storedPhotoPath(uploadsDir, photo.fileName, 'request_photo'), mime: photo.mime };
}
