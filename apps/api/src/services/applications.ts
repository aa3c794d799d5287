/**
 * Application records: what a crew or a foreman put on a field on a work order (feed, seed,
 * topdressing, a pesticide), with the station's weather that day. Pesticide records name the
 * applicator's licence.
 */
import { and, asc, desc, eq, gte, lte, sql, type SQL } from 'drizzle-orm';
import { APPLICATION_TASKS, appError, errors, type ApplicationInput, type ApplicationRow, type ApplicationTask, type ApplicationWeather, type DateRangeQuery } from '@swardwise/domain';
import type { Db, Queryable } from '../db/client.ts';
import { applications, fields, sites, users, weatherDays } from '../db/schema/index.ts';
import { writeAudit } from './audit.ts';
import { authorize, can, type Ctx } from './context.ts';
import { onFieldJoins, placeScope } from './scope.ts';
import { nearestStation, stationsWithWeather } from './stations.ts';
import { orderFor } from './work-reports.ts';

/** The day's weather at the station nearest the site, as on file (null when the station has no such day). */
async function weatherOn(db: Queryable, site: { lat: number; lng: number }, date: string): Promise<ApplicationWeather | null> {
  const station = nearestStation(await stationsWithWeather(db), site);
  if (!station) return null;
  const [d] = await db
    .select({ tmaxC: weatherDays.tmaxC, tminC: weatherDays.tminC, rainMm: weatherDays.rainMm, windMs: weatherDays.windMs, kind: weatherDays.kind })
    .from(weatherDays)
    .where(and(eq(weatherDays.stationId, station.id), eq(weatherDays.date, date)))
    .orderBy(asc(weatherDays.kind))
    .limit(1);
  return d ? { stationName: station.name, date, tmaxC: d.tmaxC, tminC: d.tminC, rainMm: d.rainMm, windMs: d.windMs, kind: d.kind } : null;
}

const rowColumns = {
  id: applications.id,
  fieldId: applications.fieldId,
  fieldName: fields.name,
  siteName: sites.name,
  districtId: applications.districtId,
  siteId: applications.siteId,
  workOrderId: applications.workOrderId,
  task: applications.task,
  product: applications.product,
  rate: applications.rate,
  rateUnit: applications.rateUnit,
  areaM2: applications.areaM2,
  appliedOn: applications.appliedOn,
  applicator: applications.applicator,
  licenceNumber: applications.licenceNumber,
  weather: applications.weather,
  notes: applications.notes,
  createdByName: sql<string | null>`${users.name}`,
  createdAt: applications.createdAt,
};

async function selectApplications(db: Queryable, where: SQL | undefined) {
  return onFieldJoins(db.select(rowColumns).from(applications).$dynamic(), { fieldId: applications.fieldId, siteId: applications.siteId, by: applications.createdBy })
    .where(where)
    .orderBy(desc(applications.appliedOn), desc(applications.id));
}

const strip = ({ siteId: _s, ...r }: Awaited<ReturnType<typeof selectApplications>>[number]): ApplicationRow<Date> => r;

/**
 * Records an application on a work order. The order is checked before the body is used (the
 * crew lead of its crew, the district's foreman, the department); the order must put
 * something on the field; weed control needs the applicator's licence number; the date is
 * not in the future.
 */
export async function recordApplication(ctx: Ctx, orderId: number, input: ApplicationInput): Promise<ApplicationRow<Date>> {
  const order = await orderFor(ctx, orderId, 'log');
  const { fieldId, siteId } = order;
  if (!(APPLICATION_TASKS as readonly string[]).includes(order.task) || fieldId === null || siteId === null) {
    throw appError('application/not_applicable', 'Nothing is applied on this kind of job: record applications on feed, overseeding, topdressing or weed control', { task: order.task });
  }
  const task = order.task as ApplicationTask;
  const issues: { path: string; message: string }[] = [];
  if (task === 'weed_control' && !input.licenceNumber) issues.push({ path: 'body.licenceNumber', message: "a pesticide application needs the applicator's licence number" });
  if (input.appliedOn > ctx.clock.today()) issues.push({ path: 'body.appliedOn', message: 'an application cannot be recorded for a day still to come' });
  if (issues.length) throw errors.invalid(issues[0]!.message, issues);
  const [site] = await ctx.db.select({ lat: sites.lat, lng: sites.lng }).from(sites).where(eq(sites.id, siteId));
  const weather = site ? await weatherOn(ctx.db, site, input.appliedOn) : null;
  const id = await (ctx.db as Db).transaction(async (tx) => {
    const [row] = await tx
      .insert(applications)
      .values({ fieldId, siteId, districtId: order.districtId, workOrderId: order.id, task, ...input, licenceNumber: input.licenceNumber || null, weather, createdBy: ctx.actor.id })
      .returning();
    await writeAudit(tx, { actorId: ctx.actor.id, action: 'create', entity: 'application', entityId: row!.id, districtId: order.districtId, before: null, after: row! });
    return row!.id;
  });
  const [out] = await selectApplications(ctx.db, eq(applications.id, id));
  return strip(out!);
}

/** Applications over a range of dates, inside what the caller may read (a crew lead: his district). */
export async function listApplications(ctx: Ctx, q: DateRangeQuery): Promise<ApplicationRow<Date>[]> {
  authorize(ctx, 'read', 'WorkOrder', q.districtId ? { districtId: q.districtId } : undefined);
  const conditions: (SQL | undefined)[] = [gte(applications.appliedOn, q.from), lte(applications.appliedOn, q.to), placeScope(ctx.actor, applications.districtId, applications.siteId)];
  if (q.districtId) conditions.push(eq(applications.districtId, q.districtId));
  const rows = await selectApplications(ctx.db, and(...conditions));
  return rows.filter((r) => can(ctx, 'read', 'WorkOrder', { districtId: r.districtId, siteId: r.siteId })).map(strip);
}
