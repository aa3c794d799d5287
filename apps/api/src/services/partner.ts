/**
 * The partner's own pages: the fields of their sites in plain words. Built from a handful of
 * scoped queries; the answers are written field by field from the contract, so nothing the
 * staff see (costs, internal closure notes, crews, staff names, districts) can slip in.
 */
import { and, asc, desc, eq, gte, inArray, isNull, ne, sql } from 'drizzle-orm';
import {
  CLOSURE_REASON_PUBLIC,
  PARTNER_CAUTIONS,
  PARTNER_STATUS_HEADLINES,
  addDaysIso,
  errors,
  levelStandard,
  mowingDueBy,
  scoreMeaning,
  type ClosureStatus,
  type Level,
  type PartnerAgendaItem,
  type PartnerFieldAnswer,
  type PartnerFieldStatus,
  type PartnerFieldsAnswer,
  type PartnerFieldSummary,
  type LineLayout,
  type PartnerNextWork,
  type PartnerRequestItem,
  type PartnerSite,
  type Standards,
  type WorkTask,
} from '@swardwise/domain';
import type { Queryable } from '../db/client.ts';
import { fieldChecks, fieldClosures, fieldEvents, fieldRequests, fields, sites, workOrders, workPhotos } from '../db/schema/index.ts';
import { authorize, can, type Ctx } from './context.ts';
import { bookingFacts } from './field-events.ts';
import { requestFacts } from './requests.ts';
import { siteScope } from './scope.ts';
import { storedPhotoPath } from './work-photos.ts';
import { loadStandards } from './standards.ts';

/** Work that is still to happen: what "next" means. */
const COMING_WORK = ['planned', 'assigned', 'started'] as const;

/** The fields of the caller's sites (retired ones are not played on). */
async function partnerFields(ctx: Ctx, fieldId?: number) {
  const rows = await ctx.db
    .select({
      id: fields.id,
      name: fields.name,
      sport: fields.sport,
      status: fields.status,
      maintenanceLevel: fields.maintenanceLevel,
      lastMowedOn: fields.lastMowedOn,
      siteId: fields.siteId,
      districtId: sites.districtId,
      siteName: sites.name,
      siteAddress: sites.address,
    })
    .from(fields)
    .innerJoin(sites, eq(sites.id, fields.siteId))
    .where(and(siteScope(ctx.actor), ne(fields.status, 'retired'), fieldId === undefined ? undefined : eq(fields.id, fieldId)))
    .orderBy(asc(sites.name), asc(fields.name));
  return rows.filter((f) => can(ctx, 'read', 'Field', f));
}
type PartnerFieldRow = Awaited<ReturnType<typeof partnerFields>>[number];

/** The decision in force per field. */
async function currentClosures(db: Queryable, ids: number[]) {
  if (!ids.length) return new Map<number, { status: ClosureStatus; reason: keyof typeof CLOSURE_REASON_PUBLIC | null; fromAt: Date; expectedReopenOn: string | null }>();
  const rows = await db
    .select({ fieldId: fieldClosures.fieldId, status: fieldClosures.status, reason: fieldClosures.reason, fromAt: fieldClosures.fromAt, expectedReopenOn: fieldClosures.expectedReopenOn })
    .from(fieldClosures)
    .where(and(inArray(fieldClosures.fieldId, ids), isNull(fieldClosures.toAt)));
  return new Map(rows.map((r) => [r.fieldId, r]));
}

/** The latest field check per field. */
async function latestChecks(db: Queryable, ids: number[]) {
  if (!ids.length) return new Map<number, { checkedOn: string; score: number; workOrderId: number | null }>();
  const rows = await db
    .selectDistinctOn([fieldChecks.fieldId], { fieldId: fieldChecks.fieldId, checkedOn: fieldChecks.checkedOn, score: fieldChecks.score, workOrderId: fieldChecks.workOrderId })
    .from(fieldChecks)
    .where(inArray(fieldChecks.fieldId, ids))
    .orderBy(fieldChecks.fieldId, desc(fieldChecks.checkedOn), desc(fieldChecks.id));
  return new Map(rows.map((r) => [r.fieldId, r]));
}

/** The first coming mowing and line painting on the week plan per field. */
async function comingWork(db: Queryable, ids: number[], today: string) {
  const out = new Map<string, string>();
  if (!ids.length) return out;
  const rows = await db
    .select({ fieldId: workOrders.fieldId, task: workOrders.task, on: sql<string>`min(${workOrders.plannedDate})::text` })
    .from(workOrders)
    .where(and(inArray(workOrders.fieldId, ids), inArray(workOrders.task, ['mow', 'paint_lines']), inArray(workOrders.status, COMING_WORK), gte(workOrders.plannedDate, today)))
    .groupBy(workOrders.fieldId, workOrders.task);
  for (const r of rows) out.set(`${r.fieldId}:${r.task}`, r.on);
  return out;
}

function statusOf(field: PartnerFieldRow, closure: Awaited<ReturnType<typeof currentClosures>> extends Map<number, infer C> ? C | undefined : never, ctx: Ctx): PartnerFieldStatus {
  const status: ClosureStatus = field.status === 'closed' || field.status === 'restricted' ? field.status : 'open';
  const inForce = closure && closure.status === status ? closure : undefined;
  return {
    status,
    headline: PARTNER_STATUS_HEADLINES[status],
    reason: status === 'open' ? null : inForce?.reason ? CLOSURE_REASON_PUBLIC[inForce.reason] : CLOSURE_REASON_PUBLIC.other,
    since: inForce ? ctx.clock.dateOf(inForce.fromAt) : null,
    expectedReopenOn: status === 'open' ? null : (inForce?.expectedReopenOn ?? null),
  };
}

/**
 * The next mowing: the week plan's when it has one; else the latest day the field's level
 * allows after its last mowing (`mowingDueBy`; growth can make it sooner, never later), and
 * today when that day has passed.
 */
function nextMowing(field: PartnerFieldRow, planned: string | undefined, standards: Standards, today: string): PartnerNextWork {
  if (planned) return { on: planned, basis: 'planned' };
  const due = mowingDueBy(field.lastMowedOn, levelStandard(field.maintenanceLevel as Level, standards), today);
  if (!due.dueOn) return { on: null, basis: null };
  return { on: due.dueOn < today ? today : due.dueOn, basis: 'due' };
}

const nextPlanned = (on: string | undefined): PartnerNextWork => (on ? { on, basis: 'planned' } : { on: null, basis: null });
const workKey = (fieldId: number, task: WorkTask) => `${fieldId}:${task}`;

/** `GET /api/partner/fields`: every field of the partner's sites, grouped by site. */
export async function partnerFieldsAnswer(ctx: Ctx): Promise<PartnerFieldsAnswer> {
  authorize(ctx, 'read', 'PartnerView');
  const today = ctx.clock.today();
  const list = await partnerFields(ctx);
  const ids = list.map((f) => f.id);
  const closures = await currentClosures(ctx.db, ids);
  const checks = await latestChecks(ctx.db, ids);
  const work = await comingWork(ctx.db, ids, today);
  const { standards } = await loadStandards(ctx.db);
  const bookingCounts = new Map<number, number>();
  if (ids.length) {
    const counts = await ctx.db
      .select({ fieldId: fieldEvents.fieldId, n: sql<number>`count(*)::int` })
      .from(fieldEvents)
      .where(and(inArray(fieldEvents.fieldId, ids), gte(fieldEvents.startsOn, today)))
      .groupBy(fieldEvents.fieldId);
    for (const c of counts) bookingCounts.set(c.fieldId, c.n);
  }

  const bySite = new Map<number, PartnerSite>();
  for (const f of list) {
    const check = checks.get(f.id);
    const summary: PartnerFieldSummary = {
      id: f.id,
      name: f.name,
      sport: f.sport,
      status: statusOf(f, closures.get(f.id), ctx),
      score: check ? Math.round(check.score) : null,
      checkedOn: check?.checkedOn ?? null,
      nextMowing: nextMowing(f, work.get(workKey(f.id, 'mow')), standards, today),
      nextLines: nextPlanned(work.get(workKey(f.id, 'paint_lines'))),
      comingBookings: bookingCounts.get(f.id) ?? 0,
    };
    const site = bySite.get(f.siteId) ?? { name: f.siteName, address: f.siteAddress, fields: [] };
    site.fields.push(summary);
    bySite.set(f.siteId, site);
  }
  return { today, sites: [...bySite.values()], cautions: [...PARTNER_CAUTIONS] };
}

/** One of the caller's fields; another school's field is "not found", as if it did not exist. */
async function partnerField(ctx: Ctx, id: number) {
  authorize(ctx, 'read', 'PartnerView');
  const [field] = await partnerFields(ctx, id);
  if (!field) throw errors.notFound('field', id);
  return field;
}

export const partnerPhotoUrl = (fieldId: number, photoId: number) => `/api/partner/fields/${fieldId}/photos/${photoId}`;

/** `GET /api/partner/fields/:id`: one field with its check, coming work and the one list of bookings. */
export async function partnerFieldAnswer(ctx: Ctx, id: number): Promise<PartnerFieldAnswer> {
  const f = await partnerField(ctx, id);
  const today = ctx.clock.today();
  const closure = (await currentClosures(ctx.db, [f.id])).get(f.id);
  const check = (await latestChecks(ctx.db, [f.id])).get(f.id);
  const work = await comingWork(ctx.db, [f.id], today);
  const { standards } = await loadStandards(ctx.db);
  const photos = check?.workOrderId
    ? await ctx.db
        .select({ id: workPhotos.id, width: workPhotos.width, height: workPhotos.height })
        .from(workPhotos)
        .where(eq(workPhotos.workOrderId, check.workOrderId))
        .orderBy(asc(workPhotos.id))
    : [];
  const bookings = await ctx.db
    .select({
      id: fieldEvents.id,
      ...bookingFacts,
    })
    .from(fieldEvents)
    .where(and(eq(fieldEvents.fieldId, f.id), gte(fieldEvents.startsOn, today)))
    .orderBy(asc(fieldEvents.startsOn), sql`${fieldEvents.startTime} asc nulls first`, asc(fieldEvents.id));
  const agenda: PartnerAgendaItem[] = bookings.map((b) => {
    const mine = b.createdBy === ctx.actor.id;
    return { type: 'booking', id: b.id, kind: b.kind, title: b.title, startsOn: b.startsOn, startTime: b.startTime, notes: mine ? b.notes : '', mine, version: mine ? b.version : null };
  });
  agenda.push(...(await fieldRequestItems(ctx, f, today)));
  // Bookings before requests on the same day; `sort` is stable, so each kind keeps its own order.
  agenda.sort((a, b) => a.startsOn.localeCompare(b.startsOn) || (a.startTime ?? '').localeCompare(b.startTime ?? ''));
  const targetScore = levelStandard(f.maintenanceLevel as Level, standards).targetScore;
  return {
    today,
    field: { id: f.id, name: f.name, sport: f.sport, siteName: f.siteName, siteAddress: f.siteAddress },
    status: statusOf(f, closure, ctx),
    check: check
      ? {
          checkedOn: check.checkedOn,
          score: Math.round(check.score),
          targetScore,
          meaning: scoreMeaning(check.score, targetScore),
          photos: photos.map((p) => ({ url: partnerPhotoUrl(f.id, p.id), width: p.width, height: p.height })),
        }
      : null,
    nextMowing: nextMowing(f, work.get(workKey(f.id, 'mow')), standards, today),
    nextLines: nextPlanned(work.get(workKey(f.id, 'paint_lines'))),
    agenda,
    canBook: can(ctx, 'create', 'FieldEvent', { siteId: f.siteId, districtId: f.districtId }),
    cautions: [...PARTNER_CAUTIONS],
  };
}

/** How long a closed (done or declined) request stays in the partner's list, in days. */
const CLOSED_REQUEST_DAYS = 14;

/**
 * The field's requests the partner may read: a game request while its day lies ahead, any other
 * while it is open or for two weeks after it was closed, so the partner sees how it ended.
 */
async function fieldRequestItems(ctx: Ctx, f: { id: number; siteId: number; districtId: number }, today: string): Promise<PartnerRequestItem[]> {
  const rows = await ctx.db
    .select({
      id: fieldRequests.id,
      ...requestFacts,
      createdBy: fieldRequests.createdBy,
      createdAt: fieldRequests.createdAt,
      closedAt: fieldRequests.closedAt,
      version: fieldRequests.version,
    })
    .from(fieldRequests)
    .where(eq(fieldRequests.fieldId, f.id))
    .orderBy(asc(fieldRequests.createdAt), asc(fieldRequests.id));
  const since = addDaysIso(today, -CLOSED_REQUEST_DAYS);
  return rows
    .filter((r) => can(ctx, 'read', 'Request', { siteId: f.siteId, districtId: f.districtId, createdBy: r.createdBy }))
    .filter((r) => (r.gameOn ? r.gameOn >= today : r.state === 'requested' || r.state === 'scheduled' || (r.closedAt !== null && ctx.clock.dateOf(r.closedAt) >= since)))
    .map((r) => {
      const mine = r.createdBy === ctx.actor.id;
      return {
        type: 'request',
        id: r.id,
        kind: r.kind,
        startsOn: r.gameOn ?? ctx.clock.dateOf(r.createdAt),
        gameOn: r.gameOn,
        startTime: r.startTime,
        layout: r.layout as LineLayout | null,
        description: r.description,
        state: r.state,
        reason: r.reason,
        mine,
        version: mine ? r.version : null,
      };
    });
}

/** A photo of the field's latest check, for a partner of the field's site; any other photo is "not found". */
export async function partnerPhotoFile(ctx: Ctx, fieldId: number, photoId: number, uploadsDir: string) {
  const f = await partnerField(ctx, fieldId);
  const check = (await latestChecks(ctx.db, [f.id])).get(f.id);
  const [photo] = check?.workOrderId
    ? await ctx.db
        .select({ fileName: workPhotos.fileName, mime: workPhotos.mime })
        .from(workPhotos)
        .where(and(eq(workPhotos.id, photoId), eq(workPhotos.workOrderId, check.workOrderId)))
    : [];
  if (!photo) throw errors.notFound('work_photo', photoId);
  return { file: await storedPhotoPath(uploadsDir, photo.fileName), mime: photo.mime };
}
