/**
 * Private calendar feeds (iCalendar, RFC 5545) for the calendar programs people already use: a
 * partner's of their fields' bookings, game-day work and closures; a crew's of its work orders
 * and its fields' closures, made by the district's foreman. The address carries a random
 * secret; only its SHA-256 is stored, a new feed for the same owner revokes the old, and the
 * feed route needs no sign-in, only a working secret. Times are the department's (VTIMEZONE).
 */
import crypto from 'node:crypto';
import { and, asc, eq, gte, inArray, isNull, lte, or, sql, type SQL } from 'drizzle-orm';
import icalGenerator, { ICalCalendarMethod } from 'ical-generator';
import { getVtimezoneComponent } from '@touch4it/ical-timezones';
import {
  addDaysIso,
  closureCaution,
  CLOSURE_REASON_PUBLIC,
  errors,
  FIELD_EVENT_KIND_LABELS,
  PARTNER_STATUS_HEADLINES,
  WORK_TASK_LABELS,
  type CalendarFeedCreated,
  type CalendarFeedList,
  type CalendarFeedSlot,
  type CreateCalendarFeedInput,
} from '@swardwise/domain';
import type { Db, Queryable } from '../db/client.ts';
import { calendarFeeds, crews, equipment, fieldClosures, fieldEvents, fields, sites, users, userSites, workOrders } from '../db/schema/index.ts';
import { writeAudit } from './audit.ts';
import type { Clock } from './clock.ts';
import { authorize, can, type Ctx } from './context.ts';

/** What a feed shows around today: the recent past and the season ahead. */
const PAST_DAYS = 30;
const AHEAD_DAYS = 180;
/** A booking has a start time only; calendars show it as this long (department rule). */
const BOOKING_HOURS = 2;
/** Work that did not happen is left out. */
const SHOWN_WORK = ['planned', 'assigned', 'started', 'done'] as const;

const hashToken = (token: string) => crypto.createHash('sha256').update(token).digest('hex');

/** The crews of the caller's district (a foreman), or none. */
async function crewsOf(ctx: Ctx) {
  if (ctx.actor.role !== 'foreman' && ctx.actor.role !== 'admin') return [];
  const rows = await ctx.db
    .select({ id: crews.id, name: crews.name, districtId: crews.districtId })
    .from(crews)
    .where(ctx.actor.role === 'foreman' ? eq(crews.districtId, ctx.actor.districtId ?? -1) : undefined)
    .orderBy(asc(crews.name));
  return rows.filter((c) => can(ctx, 'read', 'CalendarFeed', { crewId: c.id, districtId: c.districtId }));
}

/** `GET /api/calendar-feeds`: the feeds the caller may have, each with the one that works now. */
export async function listCalendarFeeds(ctx: Ctx): Promise<CalendarFeedList<Date>> {
  authorize(ctx, 'read', 'CalendarFeed');
  const live = await ctx.db
    .select({ id: calendarFeeds.id, userId: calendarFeeds.userId, crewId: calendarFeeds.crewId, kind: calendarFeeds.kind, createdAt: calendarFeeds.createdAt })
    .from(calendarFeeds)
    .where(and(isNull(calendarFeeds.revokedAt), or(and(eq(calendarFeeds.kind, 'partner'), eq(calendarFeeds.userId, ctx.actor.id)), eq(calendarFeeds.kind, 'crew'))));
  const feedOf = (match: (f: (typeof live)[number]) => boolean) => {
    const f = live.find(match);
    return f ? { id: f.id, createdAt: f.createdAt } : null;
  };
  const items: CalendarFeedSlot<Date>[] = [];
  if (ctx.actor.role === 'partner') items.push({ kind: 'partner', crewId: null, name: 'Your fields', feed: feedOf((f) => f.kind === 'partner') });
  for (const crew of await crewsOf(ctx)) items.push({ kind: 'crew', crewId: crew.id, name: crew.name, feed: feedOf((f) => f.kind === 'crew' && f.crewId === crew.id) });
  return { items };
}

/** `POST /api/calendar-feeds`: a new secret address; the owner's previous feed stops working. */
export async function createCalendarFeed(ctx: Ctx, input: CreateCalendarFeedInput, publicUrl: string): Promise<CalendarFeedCreated<Date>> {
  let owner: { kind: 'partner' | 'crew'; userId: number | null; crewId: number | null; districtId: number | null };
  if (input.crewId === undefined) {
    owner = { kind: 'partner', userId: ctx.actor.id, crewId: null, districtId: null };
    authorize(ctx, 'create', 'CalendarFeed', ctx.actor.role === 'partner' ? { userId: ctx.actor.id } : { districtId: -1 });
  } else {
    const [crew] = await ctx.db.select({ id: crews.id, districtId: crews.districtId }).from(crews).where(eq(crews.id, input.crewId));
    if (!crew) throw errors.noSuch('crew', 'body.crewId');
    authorize(ctx, 'create', 'CalendarFeed', { crewId: crew.id, districtId: crew.districtId });
    owner = { kind: 'crew', userId: null, crewId: crew.id, districtId: crew.districtId };
  }
  const token = crypto.randomBytes(32).toString('base64url');
  const created = await (ctx.db as Db).transaction(async (tx) => {
    const same = owner.kind === 'partner' ? and(eq(calendarFeeds.kind, 'partner'), eq(calendarFeeds.userId, ctx.actor.id)) : and(eq(calendarFeeds.kind, 'crew'), eq(calendarFeeds.crewId, owner.crewId!));
    const revoked = await tx.update(calendarFeeds).set({ revokedAt: ctx.clock.now() }).where(and(same, isNull(calendarFeeds.revokedAt))).returning({ id: calendarFeeds.id });
    const [row] = await tx
      .insert(calendarFeeds)
      .values({ ...owner, tokenHash: hashToken(token), createdBy: ctx.actor.id })
      .returning({ id: calendarFeeds.id, kind: calendarFeeds.kind, userId: calendarFeeds.userId, crewId: calendarFeeds.crewId, createdAt: calendarFeeds.createdAt });
    await writeAudit(tx, [
      ...revoked.map((r) => ({ actorId: ctx.actor.id, action: 'delete' as const, entity: 'calendar_feed', entityId: r.id, districtId: owner.districtId, before: { id: r.id }, after: null })),
      { actorId: ctx.actor.id, action: 'create', entity: 'calendar_feed', entityId: row!.id, districtId: owner.districtId, before: null, after: row! },
    ]);
    return row!;
  });
  return { feed: { id: created.id, createdAt: created.createdAt }, url: `${publicUrl.replace(/\/$/, '')}/api/calendar/${token}.ics` };
}

/** `DELETE /api/calendar-feeds/:id`: the address stops working at once. */
export async function revokeCalendarFeed(ctx: Ctx, id: number): Promise<void> {
  const [row] = await ctx.db
    .select({ id: calendarFeeds.id, kind: calendarFeeds.kind, userId: calendarFeeds.userId, crewId: calendarFeeds.crewId, districtId: calendarFeeds.districtId })
    .from(calendarFeeds)
    .where(and(eq(calendarFeeds.id, id), isNull(calendarFeeds.revokedAt)));
  if (!row) throw errors.notFound('calendar_feed', id);
  authorize(ctx, 'delete', 'CalendarFeed', row);
  await (ctx.db as Db).transaction(async (tx) => {
    await tx.update(calendarFeeds).set({ revokedAt: ctx.clock.now() }).where(eq(calendarFeeds.id, id));
    await writeAudit(tx, { actorId: ctx.actor.id, action: 'delete', entity: 'calendar_feed', entityId: id, districtId: row.districtId, before: row, after: null });
  });
}

/**
 * A local date and time without offset: ical-generator parses it with the process's clock and
 * writes it back with the same, so the digits reach the feed unchanged beside the event's TZID
 * (or as the date of an all-day event), whatever zone the server runs in.
 */
const local = (date: string, time = '00:00') => `${date}T${time}:00`;
const hoursAfter = (date: string, time: string, hours: number) => {
  const [h, m] = time.split(':').map(Number) as [number, number];
  const total = h * 60 + m + hours * 60;
  const day = addDaysIso(date, Math.floor(total / 1440));
  const rest = total % 1440;
  return local(day, `${String(Math.floor(rest / 60)).padStart(2, '0')}:${String(rest % 60).padStart(2, '0')}`);
};

interface FeedFields {
  ids: number[];
  names: Map<number, string>;
}

async function fieldsWhere(db: Queryable, where: SQL | undefined): Promise<FeedFields> {
  const rows = await db.select({ id: fields.id, name: fields.name, siteName: sites.name }).from(fields).innerJoin(sites, eq(sites.id, fields.siteId)).where(where);
  return { ids: rows.map((r) => r.id), names: new Map(rows.map((r) => [r.id, `${r.name}, ${r.siteName}`])) };
}

/**
 * The feed behind a secret, as iCalendar text; a secret that is unknown or revoked is "not
 * found", so a guess tells nothing. The partner's scope is read afresh at each request: a
 * site unlinked from him leaves his feed at once.
 */
export async function calendarFeedIcs(db: Queryable, clock: Clock, token: string): Promise<string> {
  const [feed] = await db
    .select({ id: calendarFeeds.id, kind: calendarFeeds.kind, userId: calendarFeeds.userId, crewId: calendarFeeds.crewId, active: users.active, role: users.role, crewName: crews.name })
    .from(calendarFeeds)
    .leftJoin(users, eq(users.id, calendarFeeds.userId))
    .leftJoin(crews, eq(crews.id, calendarFeeds.crewId))
    .where(and(eq(calendarFeeds.tokenHash, hashToken(token)), isNull(calendarFeeds.revokedAt)));
  if (!feed || (feed.kind === 'partner' && (!feed.active || feed.role !== 'partner'))) throw errors.notFound('calendar_feed', 0);

  const today = clock.today();
  const from = addDaysIso(today, -PAST_DAYS);
  const to = addDaysIso(today, AHEAD_DAYS);
  const calendar = icalGenerator({
    name: feed.kind === 'partner' ? 'Swardwise: my fields' : `Swardwise: ${feed.crewName ?? 'crew'} work`,
    prodId: { company: 'Swardwise', product: 'calendar-feed', language: 'EN' },
    method: ICalCalendarMethod.PUBLISH,
    timezone: { name: clock.timeZone, generator: getVtimezoneComponent },
    ttl: 60 * 30,
  });

  // ical-generator writes every time of a calendar with a zone as read by the process's local
  // clock; the stamp is given as the UTC digits of now so it reads the same on any server.
  const stamp = clock.now().toISOString().replace(/\.\d+Z$/, '');

  let scope: FeedFields;
  if (feed.kind === 'partner') {
    const linked = db.select({ siteId: userSites.siteId }).from(userSites).where(eq(userSites.userId, feed.userId!));
    scope = await fieldsWhere(db, inArray(fields.siteId, linked));
  } else {
    const worked = db
      .selectDistinct({ fieldId: workOrders.fieldId })
      .from(workOrders)
      .where(and(eq(workOrders.crewId, feed.crewId!), gte(workOrders.plannedDate, from), lte(workOrders.plannedDate, to)));
    scope = await fieldsWhere(db, inArray(fields.id, worked));
  }
  // A crew's feed also carries its yard jobs, which have no field.
  if (!scope.ids.length && feed.kind === 'partner') return calendar.toString();
  const where = (fieldId: number | null) => (fieldId === null ? 'the yard' : (scope.names.get(fieldId) ?? 'a field'));

  const bookings = await db
    .select({ id: fieldEvents.id, fieldId: fieldEvents.fieldId, kind: fieldEvents.kind, title: fieldEvents.title, startsOn: fieldEvents.startsOn, startTime: fieldEvents.startTime })
    .from(fieldEvents)
    .where(and(inArray(fieldEvents.fieldId, scope.ids), gte(fieldEvents.startsOn, from), lte(fieldEvents.startsOn, to)));
  const gameDays = new Set(bookings.map((b) => `${b.fieldId}:${b.startsOn}`));
  if (feed.kind === 'partner') {
    for (const b of bookings) {
      calendar.createEvent({
        id: `booking-${b.id}@swardwise`,
        summary: `${b.title} (${where(b.fieldId)})`,
        description: `${FIELD_EVENT_KIND_LABELS[b.kind]} booked on ${where(b.fieldId)}.`,
        location: where(b.fieldId),
        stamp,
        ...(b.startTime ? { start: local(b.startsOn, b.startTime), end: hoursAfter(b.startsOn, b.startTime, BOOKING_HOURS), timezone: clock.timeZone } : { start: local(b.startsOn), allDay: true }),
      });
    }
  }

  const work = await db
    .select({ id: workOrders.id, fieldId: workOrders.fieldId, task: workOrders.task, plannedDate: workOrders.plannedDate, status: workOrders.status, equipmentName: equipment.name })
    .from(workOrders)
    .leftJoin(equipment, eq(equipment.id, workOrders.equipmentId))
    .where(
      and(
        feed.kind === 'partner' ? and(inArray(workOrders.fieldId, scope.ids), inArray(workOrders.task, ['mow', 'paint_lines'])) : eq(workOrders.crewId, feed.crewId!),
        inArray(workOrders.status, SHOWN_WORK),
        gte(workOrders.plannedDate, from),
        lte(workOrders.plannedDate, to),
      ),
    );
  for (const w of work) {
    // A partner sees the work that readies a game: lines, and mowing on the game's day or the day before.
    const forGame = w.task === 'paint_lines' || gameDays.has(`${w.fieldId}:${w.plannedDate}`) || gameDays.has(`${w.fieldId}:${addDaysIso(w.plannedDate, 1)}`);
    if (feed.kind === 'partner' && !forGame) continue;
    const label = w.task === 'paint_lines' ? 'Line painting' : w.task === 'mow' ? 'Mowing' : WORK_TASK_LABELS[w.task];
    calendar.createEvent({
      id: `work-${w.id}@swardwise`,
      summary: w.fieldId === null && w.equipmentName ? `${label} — ${w.equipmentName} (the yard)` : `${label}: ${where(w.fieldId)}`,
      description: w.status === 'done' ? `${label} done.` : `${label} planned by the parks department; the day can move with the weather.`,
      location: where(w.fieldId),
      stamp,
      start: local(w.plannedDate),
      allDay: true,
    });
  }

  const closures = await db
    .select({ id: fieldClosures.id, fieldId: fieldClosures.fieldId, status: fieldClosures.status, reason: fieldClosures.reason, fromAt: fieldClosures.fromAt, toAt: fieldClosures.toAt, expectedReopenOn: fieldClosures.expectedReopenOn })
    .from(fieldClosures)
    .where(and(inArray(fieldClosures.fieldId, scope.ids), inArray(fieldClosures.status, ['closed', 'restricted']), or(isNull(fieldClosures.toAt), gte(fieldClosures.toAt, sql`${new Date(Date.parse(`${from}T00:00:00Z`))}`))));
  for (const c of closures) {
    const start = clock.dateOf(c.fromAt);
    // All-day events end on the day after (RFC 5545 DTEND is exclusive): the reopening day, or today while no day is set.
    const end = c.toAt ? addDaysIso(clock.dateOf(c.toAt), 1) : c.expectedReopenOn && c.expectedReopenOn > start ? c.expectedReopenOn : addDaysIso(today > start ? today : start, 1);
    const reason = c.reason ? CLOSURE_REASON_PUBLIC[c.reason] : CLOSURE_REASON_PUBLIC.other;
    const caution = c.reason ? closureCaution(c.reason) : null;
    const reopen = c.toAt ? 'Reopened.' : c.expectedReopenOn ? `Expected to reopen on ${c.expectedReopenOn}.` : 'No reopening date is set yet.';
    calendar.createEvent({
      id: `closure-${c.id}@swardwise`,
      summary: `${c.status === 'closed' ? 'Closed' : 'Restricted'}: ${where(c.fieldId)}`,
      description: [PARTNER_STATUS_HEADLINES[c.status], reason, reopen, caution].filter(Boolean).join('\n'),
      location: where(c.fieldId),
      stamp,
      start: local(start),
      end: local(end),
      allDay: true,
    });
  }
  return calendar.toString();
}

