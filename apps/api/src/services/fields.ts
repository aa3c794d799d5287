/** Playing surfaces and lawns, each with its outline and maintenance level. */
import fs from 'node:fs/promises';
import path from 'node:path';
import { and, asc, count, eq, inArray, sql, type SQL } from 'drizzle-orm';
import { longAxis, polygonAreaM2, appError, errors, type CreateFieldInput, type FieldDetail, type FieldRow, type Polygon, type UpdateFieldInput } from '@swardwise/domain';
import type { Db, Queryable } from '../db/client.ts';
import { districts, fieldCheckPhotos, fieldChecks, fields, sites, workOrders, workPhotos } from '../db/schema/index.ts';
import { authorize, can, type Ctx } from './context.ts';
import { cachedAnswer } from './answer-cache.ts';
import { followMove } from './scope-copies.ts';
import { fieldCrewIds, fieldScope } from './scope.ts';
import { auditRow, insertAudited, updateVersioned, versionedRows, writable } from './versioned.ts';

const listColumns = {
  id: fields.id,
  siteId: fields.siteId,
  siteName: sites.name,
  districtId: sites.districtId,
  districtName: districts.name,
  name: fields.name,
  sport: fields.sport,
  grass: fields.grass,
  rootzone: fields.rootzone,
  irrigation: fields.irrigation,
  maintenanceLevel: fields.maintenanceLevel,
  hocOverrideMm: fields.hocOverrideMm,
  clippings: fields.clippings,
  status: fields.status,
  statusNote: fields.statusNote,
  weeklyUseHours: fields.weeklyUseHours,
  areaM2: fields.areaM2,
  longAxisDeg: fields.longAxisDeg,
  lastMowedOn: fields.lastMowedOn,
  crewIds: fieldCrewIds,
  version: fields.version,
  updatedAt: fields.updatedAt,
};

function selectFields(db: Ctx['db']) {
  return db
    .select(listColumns)
    .from(fields)
    .innerJoin(sites, eq(sites.id, fields.siteId))
    .innerJoin(districts, eq(districts.id, sites.districtId));
}

/** Area and long axis follow the outline on every write. */
export function outlineFacts(geometry: Polygon) {
  return { areaM2: polygonAreaM2(geometry), longAxisDeg: longAxis(geometry).bearingDeg };
}

export async function getFieldRow(db: Ctx['db'], id: number) {
  const [row] = await db
    .select({ ...listColumns, geometry: fields.geometry })
    .from(fields)
    .innerJoin(sites, eq(sites.id, fields.siteId))
    .innerJoin(districts, eq(districts.id, sites.districtId))
    .where(eq(fields.id, id));
  return row;
}

export const fieldRows = versionedRows({ table: fields, subject: 'Field', resource: 'field', row: getFieldRow });

export async function listFields(ctx: Ctx, filter: { districtId?: number | undefined; siteId?: number | undefined; q?: string | undefined }): Promise<FieldRow<Date>[]> {
  authorize(ctx, 'read', 'Field');
  const conditions: (SQL | undefined)[] = [fieldScope(ctx.actor)];
  if (filter.districtId) conditions.push(eq(sites.districtId, filter.districtId));
  if (filter.siteId) conditions.push(eq(fields.siteId, filter.siteId));
  if (filter.q) conditions.push(sql`(${fields.name} ilike ${'%' + filter.q + '%'} or ${sites.name} ilike ${'%' + filter.q + '%'})`);
  const rows = await selectFields(ctx.db)
    .where(and(...conditions))
    .orderBy(asc(sites.name), asc(fields.name));
  return rows.filter((row) => can(ctx, 'read', 'Field', row));
}

/** The list as JSON, cached until a field, site or district changes (the list route's hot path). */
export async function listFieldsJson(ctx: Ctx, filter: { districtId?: number | undefined; siteId?: number | undefined; q?: string | undefined }): Promise<string> {
  authorize(ctx, 'read', 'Field');
  const key = JSON.stringify([filter.districtId ?? null, filter.siteId ?? null, filter.q ?? null]);
  return cachedAnswer(ctx, 'fields', key, async () => JSON.stringify({ items: await listFields(ctx, filter) }));
}

export async function getField(ctx: Ctx, id: number): Promise<FieldDetail<Date>> {
  const row = await getFieldRow(ctx.db, id);
  if (!row) throw errors.notFound('field', id);
  authorize(ctx, 'read', 'Field', row);
  return row;
}

/** The site a new or moved field goes on: it must exist (400) and the caller must be allowed to add fields to it (403). */
async function checkSite(ctx: Ctx, db: Ctx['db'], siteId: number): Promise<void> {
  const [site] = await db.select({ id: sites.id, districtId: sites.districtId }).from(sites).where(eq(sites.id, siteId));
  if (!site) throw errors.noSuch('site', 'body.siteId');
  authorize(ctx, 'create', 'Field', { siteId: site.id, districtId: site.districtId });
}

export async function createField(ctx: Ctx, input: CreateFieldInput): Promise<FieldDetail<Date>> {
  return (ctx.db as Db).transaction(async (tx) => {
    await checkSite(ctx, tx, input.siteId);
    return insertAudited(ctx, tx, fieldRows, { ...input, ...outlineFacts(input.geometry) });
  });
}

export function updateField(ctx: Ctx, id: number, input: UpdateFieldInput): Promise<FieldDetail<Date>> {
  return updateVersioned(ctx, fieldRows, id, input, async (tx, before, changes) => {
    if (changes.siteId !== undefined && changes.siteId !== before.siteId) await checkSite(ctx, tx, changes.siteId);
    return { ...changes, ...(changes.geometry ? outlineFacts(changes.geometry) : {}) };
  }, async (tx, before, changes) => {
    // The field's work and bookings go with it to its new site (and district).
    if (changes.siteId !== undefined && changes.siteId !== before.siteId) await followMove(tx, ctx.actor.id, { fieldId: id });
  });
}

/** What a field has on record that deleting it would lose: work started or done, and field checks. */
async function workHistoryOf(db: Queryable, fieldId: number): Promise<{ workOrders: number; fieldChecks: number }> {
  const [orders] = await db
    .select({ n: count() })
    .from(workOrders)
    .where(and(eq(workOrders.fieldId, fieldId), inArray(workOrders.status, ['started', 'done'])));
  const [checks] = await db.select({ n: count() }).from(fieldChecks).where(eq(fieldChecks.fieldId, fieldId));
  return { workOrders: orders?.n ?? 0, fieldChecks: checks?.n ?? 0 };
}

/**
 * Refuses (409) to delete a field with work on record: its done work, reports, photos and
 * checks are the department's records. Retiring the field keeps them and takes it off the plan.
 */
export async function refuseDeleteWithHistory(db: Queryable, field: { id: number; name: string }): Promise<void> {
  const history = await workHistoryOf(db, field.id);
  if (!history.workOrders && !history.fieldChecks) return;
  const what = [
    history.workOrders ? `${history.workOrders} work order${history.workOrders === 1 ? '' : 's'} started or done` : null,
    history.fieldChecks ? `${history.fieldChecks} field check${history.fieldChecks === 1 ? '' : 's'}` : null,
  ].filter(Boolean);
  throw appError(
    'field/has_work_history',
    `“${field.name}” has work on record (${what.join(' and ')}), which deleting it would lose; retire the field instead: it leaves the week plan and keeps its records`,
    { fieldId: field.id, ...history },
  );
}

/**
 * Deletes a field with what cascades from it (open work orders, their photos and reports,
 * bookings) inside the caller's transaction. Returns the photo files to remove once the
 * transaction has committed (a rolled-back delete must not lose them).
 */
export async function removeField(db: Queryable, fieldId: number, version?: number): Promise<{ deleted: boolean; photoFiles: string[] }> {
  const photos = await db
    .select({ fileName: workPhotos.fileName })
    .from(workPhotos)
    .innerJoin(workOrders, eq(workOrders.id, workPhotos.workOrderId))
    .where(eq(workOrders.fieldId, fieldId));
  const checkPhotos = await db
    .select({ fileName: fieldCheckPhotos.fileName })
    .from(fieldCheckPhotos)
    .innerJoin(fieldChecks, eq(fieldChecks.id, fieldCheckPhotos.fieldCheckId))
    .where(eq(fieldChecks.fieldId, fieldId));
  const [deleted] = await db
    .delete(fields)
    .where(version === undefined ? eq(fields.id, fieldId) : and(eq(fields.id, fieldId), eq(fields.version, version)))
    .returning({ id: fields.id });
  return { deleted: !!deleted, photoFiles: deleted ? [...photos, ...checkPhotos].map((p) => p.fileName) : [] };
}

/** Removes photo files from the uploads folder (after the rows are gone); a missing file is no error. */
export async function removePhotoFiles(uploadsDir: string, fileNames: readonly string[]): Promise<void> {
  await Promise.all(fileNames.map((name) => fs.rm(path.join(uploadsDir, path.basename(name)), { force: true })));
}

export async function deleteField(ctx: Ctx, id: number, version: number, uploadsDir: string): Promise<void> {
  const photoFiles = await (ctx.db as Db).transaction(async (tx) => {
    const before = writable(ctx, 'delete', 'Field', 'field', id, await getFieldRow(tx, id));
    if (before.version !== version) throw errors.versionConflict('field');
    await refuseDeleteWithHistory(tx, before);
    const removed = await removeField(tx, id, version);
    if (!removed.deleted) throw errors.versionConflict('field');
    await auditRow(ctx, tx, 'field', before, null);
    return removed.photoFiles;
  });
  await removePhotoFiles(uploadsDir, photoFiles);
}
