/**
 * Field checks: a crew logs one from Today on a field-check work order (the order is then
 * done), or staff log one from the field page without an order; the turf engine scores it and
 * flags what needs doing; the check is stored in `field_checks`, with the days since the last
 * mowing on record, which the field's growth calibration reads.
 */
import { and, asc, desc, eq, inArray, lte, sql, type SQL } from 'drizzle-orm';
import {
  appError,
  errors,
  fieldDailySeries,
  growthCalibrationFactor,
  hocFor,
  isoToDayNumber,
  judgeFieldCheck,
  MAX_CALIBRATION_DAYS,
  type FieldCheckAnswer,
  type FieldCheckBody,
  type FieldCheckFlag,
  type FieldCheckList,
  type FieldCheckRow,
  type FieldGrowthCalibration,
  type GrowthReading,
  type PhotoAnswer,
  type WorkPhoto,
} from '@swardwise/domain';
import type { Db, Queryable } from '../db/client.ts';
import { fieldCheckPhotos, fieldChecks, fields, sites, users, weatherDays, workPhotos } from '../db/schema/index.ts';
import { writeAudit } from './audit.ts';
import { authorize, type Ctx } from './context.ts';
import { getField } from './fields.ts';
import { loadParameters, loadStandards } from './standards.ts';
import { nearestStation, prepareStationWeather, stationsWithWeather, unbrokenRunAround } from './stations.ts';
import { photoFileName, storePhoto, storedPhotoAnswer, storedPhotoPath, type PhotoUpload } from './work-photos.ts';
import { orderFor, reportWork } from './work-reports.ts';

/** Photos a check logged from the field page keeps (as many as a work order). */
export const PHOTOS_PER_CHECK = 6;

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
  daysSinceCut: fieldChecks.daysSinceCut,
  createdAt: fieldChecks.createdAt,
};

const orderPhotoUrl = (orderId: number, photoId: number) => `/api/work-orders/${orderId}/photos/${photoId}`;
const checkPhotoUrl = (fieldId: number, checkId: number, photoId: number) => `/api/fields/${fieldId}/checks/${checkId}/photos/${photoId}`;

async function checkRows(db: Queryable, where: SQL | undefined, limit: number): Promise<FieldCheckRow<Date>[]> {
  const rows = await db.select(checkColumns).from(fieldChecks).leftJoin(users, eq(users.id, fieldChecks.checkedBy)).where(where).orderBy(desc(fieldChecks.checkedOn), desc(fieldChecks.id)).limit(limit);
  // Two queries for every check's photos, whichever way the check was logged.
  const orderIds = rows.map((r) => r.workOrderId).filter((id): id is number => id !== null);
  const checkIds = rows.map((r) => r.id);
  const [orderPhotos, ownPhotos] = await Promise.all([
    orderIds.length
      ? db.select({ id: workPhotos.id, owner: workPhotos.workOrderId, width: workPhotos.width, height: workPhotos.height, bytes: workPhotos.bytes, createdAt: workPhotos.createdAt }).from(workPhotos).where(inArray(workPhotos.workOrderId, orderIds)).orderBy(asc(workPhotos.id))
      : [],
    checkIds.length
      ? db.select({ id: fieldCheckPhotos.id, owner: fieldCheckPhotos.fieldCheckId, width: fieldCheckPhotos.width, height: fieldCheckPhotos.height, bytes: fieldCheckPhotos.bytes, createdAt: fieldCheckPhotos.createdAt }).from(fieldCheckPhotos).where(inArray(fieldCheckPhotos.fieldCheckId, checkIds)).orderBy(asc(fieldCheckPhotos.id))
      : [],
  ]);
  return rows.map((r) => {
    const photos: WorkPhoto<Date>[] = [
      ...orderPhotos.filter((p) => r.workOrderId !== null && p.owner === r.workOrderId).map(({ owner, ...p }) => ({ ...p, url: orderPhotoUrl(owner, p.id) })),
      ...ownPhotos.filter((p) => p.owner === r.id).map(({ owner, ...p }) => ({ ...p, url: checkPhotoUrl(r.fieldId, owner, p.id) })),
    ];
    return { ...r, photos };
  });
}

/** The latest checks of a field a caller may read, newest first, with the level's target score. */
export async function listFieldChecks(ctx: Ctx, fieldId: number, limit = 20): Promise<FieldCheckList<Date>> {
  const field = await getField(ctx, fieldId);
  authorize(ctx, 'read', 'FieldCheck', { districtId: field.districtId });
  const { standards } = await loadStandards(ctx.db);
  return { items: await checkRows(ctx.db, eq(fieldChecks.fieldId, fieldId), limit), targetScore: standards[field.maintenanceLevel].targetScore };
}

/**
 * Who may log a check on this field from the field page: a caller who may read the field and
 * create checks in its district. Routes call it before they read a body.
 */
export async function fieldForCheck(ctx: Ctx, fieldId: number) {
  const field = await getField(ctx, fieldId);
  authorize(ctx, 'create', 'FieldCheck', { districtId: field.districtId });
  return field;
}

/** Scores and stores a check (and its audit entry); the answer the form shows. */
async function storeCheck(ctx: Ctx, fieldId: number, districtId: number, input: FieldCheckBody, workOrderId: number | null) {
  const [field] = await ctx.db
    .select({ id: fields.id, sport: fields.sport, grass: fields.grass, maintenanceLevel: fields.maintenanceLevel, hocOverrideMm: fields.hocOverrideMm, lastMowedOn: fields.lastMowedOn })
    .from(fields)
    .where(eq(fields.id, fieldId));
  if (!field) throw errors.notFound('field', fieldId);
  const [{ standards }, parameters] = [await loadStandards(ctx.db), await loadParameters(ctx.db)];
  const hocMm = hocFor(field, standards);
  const result = judgeFieldCheck(input, { hocMm, level: field.maintenanceLevel, ranges: parameters.hardnessRangesG });
  const today = ctx.clock.today();
  // The growth calibration needs the days since the cut; a mowing dated after today is no cut yet.
  const daysSinceCut = field.lastMowedOn && field.lastMowedOn <= today ? isoToDayNumber(today) - isoToDayNumber(field.lastMowedOn) : null;
  const id = await (ctx.db as Db).transaction(async (tx) => {
    const [row] = await tx
      .insert(fieldChecks)
      .values({
        fieldId: field.id,
        checkedOn: today,
        checkedBy: ctx.actor.id,
        turfCoverPct: input.turfCoverPct,
        weedsPct: input.weedsPct,
        barePct: input.bareWornPct,
        bareAreas: input.bareAreas,
        heightMm: input.heightMm,
        daysSinceCut,
        gmax: result.hardnessG,
        gmaxDevice: result.hardnessG === null ? null : input.hardnessDevice,
        hardnessReadings: input.hardnessReadingsG,
        evenness: input.evenness,
        divots: input.divots,
        tornLeafTips: input.tornLeafTips,
        notes: input.notes,
        score: Math.round(result.score * 10) / 10,
        flags: result.flags,
        workOrderId,
      })
      .returning();
    await writeAudit(tx, { actorId: ctx.actor.id, action: 'create', entity: 'field_check', entityId: row!.id, districtId, before: null, after: row! });
    return row!.id;
  });
  return { id, result, hocMm };
}

async function checkAnswer(ctx: Ctx, stored: Awaited<ReturnType<typeof storeCheck>>): Promise<FieldCheckAnswer<Date>> {
  const [check] = await checkRows(ctx.db, eq(fieldChecks.id, stored.id), 1);
  return { check: check!, advice: stored.result.advice, cautions: stored.result.cautions, coverTargetPct: stored.result.coverTargetPct, hocMm: stored.hocMm };
}

/** A crew's field check logged on its work order; see the module comment. */
export async function logFieldCheck(ctx: Ctx, orderId: number, input: FieldCheckBody): Promise<FieldCheckAnswer<Date>> {
  const order = await orderFor(ctx, orderId, 'log');
  if (order.task !== 'field_check' || order.fieldId === null) throw appError('field_check/not_a_check', 'This work order is not a field check; report it with Done instead', { task: order.task });
  const fieldId = order.fieldId;
  if (order.status === 'done') throw appError('work_report/already_done', 'This field check is already logged; reopen the job to log it again', { status: order.status });
  authorize(ctx, 'create', 'FieldCheck', { districtId: order.districtId });
  const stored = await storeCheck(ctx, fieldId, order.districtId, input, orderId);
  const { result } = stored;
  const summary = `Field check: score ${Math.round(result.score)}${result.flags.length ? ` · ${result.flags.join(', ').replaceAll('_', ' ')}` : ''}${input.notes ? ` · ${input.notes}` : ''}`;
  await reportWork(ctx, orderId, { status: 'done', actualHours: input.actualHours ?? order.plannedHours, note: summary.slice(0, 2000) });
  return checkAnswer(ctx, stored);
}

/** A check staff log from the field page, without a work order (`fieldForCheck` decides who). */
export async function logStaffFieldCheck(ctx: Ctx, fieldId: number, input: FieldCheckBody): Promise<FieldCheckAnswer<Date>> {
  const field = await fieldForCheck(ctx, fieldId);
  return checkAnswer(ctx, await storeCheck(ctx, field.id, field.districtId, input, null));
}

/** A check of this field logged from the field page, for a caller who may log checks on it. */
async function ownCheck(ctx: Ctx, fieldId: number, checkId: number) {
  const [check] = await ctx.db
    .select({ id: fieldChecks.id, workOrderId: fieldChecks.workOrderId })
    .from(fieldChecks)
    .where(and(eq(fieldChecks.id, checkId), eq(fieldChecks.fieldId, fieldId)));
  if (!check) throw errors.notFound('field_check', checkId);
  // A check logged on a work order keeps its photos with the order (Today uploads them there).
  if (check.workOrderId !== null) throw appError('field_check/photos_on_order', 'This check was logged on a work order; add its photos to the work order', { workOrderId: check.workOrderId });
  return check;
}

/** Refuses a caller who may not add photos to this check, before the upload is read. */
export async function checkPhotoAllowed(ctx: Ctx, fieldId: number, checkId: number): Promise<void> {
  await fieldForCheck(ctx, fieldId);
  await ownCheck(ctx, fieldId, checkId);
}

/** A photo of a field-page check, re-encoded as the crews' photos are (`readImage`). */
export async function addFieldCheckPhoto(ctx: Ctx, fieldId: number, checkId: number, upload: PhotoUpload, uploadsDir: string): Promise<PhotoAnswer<Date>> {
  const field = await fieldForCheck(ctx, fieldId);
  await ownCheck(ctx, fieldId, checkId);
  const fileName = photoFileName(`fc${checkId}`, upload.clientRef);
  const { row, duplicate } = await storePhoto<typeof fieldCheckPhotos.$inferSelect>(ctx, uploadsDir, fileName, upload.buffer, {
    table: fieldCheckPhotos,
    key: { fieldCheckId: checkId },
    name: 'field check',
    limit: PHOTOS_PER_CHECK,
    entity: 'field_check_photo',
    districtId: field.districtId,
  });
  return { photo: storedPhotoAnswer(row, checkPhotoUrl(fieldId, checkId, row.id)), duplicate };
}

/** Where a field-page check's photo is, for a caller who may read the field's checks. */
export async function fieldCheckPhotoFile(ctx: Ctx, fieldId: number, checkId: number, photoId: number, uploadsDir: string) {
  const field = await getField(ctx, fieldId);
  authorize(ctx, 'read', 'FieldCheck', { districtId: field.districtId });
  const [photo] = await ctx.db
    .select({ fileName: fieldCheckPhotos.fileName, mime: fieldCheckPhotos.mime })
    .from(fieldCheckPhotos)
    .innerJoin(fieldChecks, eq(fieldChecks.id, fieldCheckPhotos.fieldCheckId))
    .where(and(eq(fieldCheckPhotos.id, photoId), eq(fieldCheckPhotos.fieldCheckId, checkId), eq(fieldChecks.fieldId, fieldId)));
  if (!photo) throw errors.notFound('work_photo', photoId);
  return { file: await storedPhotoPath(uploadsDir, photo.fileName), mime: photo.mime };
}

/** Checks the calibration reads: the latest with a height and the days since the cut. */
const CALIBRATION_CHECKS = 30;

/**
 * The field's growth against the engine's prediction (`growthCalibrationFactor`): each check
 * with a measured height and the days since the last cut on record gives the observed growth
 * (height − the field's HOC now); the predicted growth is the sum of `fieldDailySeries`'s
 * daily growth (the grass's default rate, the nearest station's weather) from the cut day to
 * the day before the check. Shown on the field page; the mowing prediction keeps the default.
 */
export async function fieldGrowthCalibration(ctx: Ctx, fieldId: number): Promise<FieldGrowthCalibration> {
  const field = await getField(ctx, fieldId);
  authorize(ctx, 'read', 'FieldCheck', { districtId: field.districtId });
  const { standards } = await loadStandards(ctx.db);
  const params = await loadParameters(ctx.db);
  const hocMm = hocFor(field, standards);
  const defaultRateMmPerDay = params.maxGrowthMmPerDay[field.grass];
  const checks = await ctx.db
    .select({ checkedOn: fieldChecks.checkedOn, heightMm: fieldChecks.heightMm, daysSinceCut: fieldChecks.daysSinceCut })
    .from(fieldChecks)
    .where(and(eq(fieldChecks.fieldId, fieldId), sql`${fieldChecks.heightMm} is not null`, sql`${fieldChecks.daysSinceCut} is not null`))
    .orderBy(desc(fieldChecks.checkedOn), desc(fieldChecks.id))
    .limit(CALIBRATION_CHECKS);

  const [site] = await ctx.db.select({ lat: sites.lat, lng: sites.lng }).from(sites).where(eq(sites.id, field.siteId));
  const station = site ? nearestStation(await stationsWithWeather(ctx.db), site) : undefined;
  const readings: GrowthReading[] = [];
  const noWeather: { checkedOn: string; reason: string }[] = [];
  if (station && checks.length) {
    const today = ctx.clock.today();
    const rows = await ctx.db.select().from(weatherDays).where(and(eq(weatherDays.stationId, station.id), lte(weatherDays.date, today))).orderBy(asc(weatherDays.date));
    const run = rows.length ? unbrokenRunAround(rows, rows.length - 1) : [];
    const prepared = run.length ? prepareStationWeather(station, run) : null;
    const growth = prepared ? fieldDailySeries({ id: field.id, areaM2: field.areaM2, sport: field.sport, grass: field.grass, maintenanceLevel: field.maintenanceLevel, hocOverrideMm: field.hocOverrideMm, clippings: field.clippings, irrigation: field.irrigation }, prepared, standards, params).growthMm : [];
    const index = new Map((prepared?.dates ?? []).map((d, i) => [d, i]));
    for (const c of checks) {
      const days = c.daysSinceCut!;
      if (days < 1 || days > MAX_CALIBRATION_DAYS) {
        // The engine leaves it out and says why; no weather is needed for that.
        readings.push({ checkedOn: c.checkedOn, measuredHeightMm: c.heightMm!, hocMm, daysSinceCut: days, predictedGrowthMm: 0 });
        continue;
      }
      const end = index.get(c.checkedOn);
      const start = end === undefined ? undefined : end - days;
      if (end === undefined || start === undefined || start < 0) {
        noWeather.push({ checkedOn: c.checkedOn, reason: 'no weather on file for the days since the cut' });
        continue;
      }
      let predicted = 0;
      for (let i = start; i < end; i++) predicted += growth[i]!;
      readings.push({ checkedOn: c.checkedOn, measuredHeightMm: c.heightMm!, hocMm, daysSinceCut: days, predictedGrowthMm: predicted });
    }
  }
  const fit = growthCalibrationFactor(readings);
  return {
    factor: fit.factor,
    n: fit.n,
    spread: fit.spread,
    confidence: fit.confidence,
    defaultRateMmPerDay,
    calibratedRateMmPerDay: defaultRateMmPerDay * fit.factor,
    hocMm,
    readings: fit.readings,
    skipped: [...fit.skipped, ...noWeather],
    usedForMowing: false,
    stationName: station?.name ?? null,
  };
}
