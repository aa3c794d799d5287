/**
 * Logos on a field: uploaded (cleaned and rendered by `logo-files.ts`), placed in the field
 * frame, moved, scaled and turned by those who may change the field, read with their grid
 * set-out and paint by anyone who may read it.
 */
import { randomUUID } from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';
import { and, asc, count, eq } from 'drizzle-orm';
import {
  appError,
  DomainError,
  errors,
  fieldFrame,
  LOGO_PIGMENT_CAUTION,
  logoGrid,
  logoHeightM,
  logoInsideField,
  logoPaint,
  type CreateLogoInput,
  type FieldLogo,
  type FieldLogos,
  type UpdateLogoInput,
} from '@swardwise/domain';
import type { Db, Queryable } from '../db/client.ts';
import { fieldLogos } from '../db/schema/index.ts';
import { writeAudit } from './audit.ts';
import type { Ctx } from './context.ts';
import { authorizeFieldWrite } from './field-write.ts';
import { getField } from './fields.ts';
import { loadParameters } from './standards.ts';
import { readLogo } from './logo-files.ts';

export const LOGOS_PER_FIELD = 10;

type LogoRow = typeof fieldLogos.$inferSelect;

const logoUrl = (fieldId: number, logoId: number) => `/api/fields/${fieldId}/logos/${logoId}`;

function frameOf(geometry: Parameters<typeof fieldFrame>[0]) {
  try {
    const f = fieldFrame(geometry);
    return { lengthM: f.lengthM, widthM: f.widthM };
  } catch {
    return { lengthM: 0, widthM: 0 };
  }
}

/** A stored logo with its grid and paint worked out from the department's first coat. */
export function logoAnswer(row: LogoRow, frame: { lengthM: number; widthM: number }, coat: Parameters<typeof logoPaint>[3]): FieldLogo<Date> {
  const heightM = logoHeightM(row.widthM, row.pixelWidth, row.pixelHeight);
  const placement = { centerXM: row.centerXM, centerYM: row.centerYM, widthM: row.widthM, heightM, rotationDeg: row.rotationDeg };
  let grid: FieldLogo['grid'] = null;
  try {
    grid = logoGrid(placement, row.gridSpacingM);
  } catch (err) {
    if (!(err instanceof DomainError)) throw err;
  }
  return {
    id: row.id,
    fieldId: row.fieldId,
    name: row.name,
    mime: row.mime,
    pixelWidth: row.pixelWidth,
    pixelHeight: row.pixelHeight,
    centerXM: row.centerXM,
    centerYM: row.centerYM,
    widthM: row.widthM,
    heightM,
    rotationDeg: row.rotationDeg,
    gridSpacingM: row.gridSpacingM,
    colours: row.colours,
    backgroundHex: row.backgroundHex,
    grid,
    paint: logoPaint(row.widthM, heightM, row.colours, coat),
    insideField: logoInsideField(placement, frame.lengthM, frame.widthM),
    imageUrl: `${logoUrl(row.fieldId, row.id)}/image`,
    pdfUrl: `${logoUrl(row.fieldId, row.id)}/grid.pdf`,
    version: row.version,
    createdAt: row.createdAt,
    updatedAt: row.updatedAt,
  };
}

/** The field's logos; anyone who may read the field. */
export async function listFieldLogos(ctx: Ctx, fieldId: number): Promise<FieldLogos<Date>> {
  const field = await getField(ctx, fieldId);
  const [rows, params] = await Promise.all([ctx.db.select().from(fieldLogos).where(eq(fieldLogos.fieldId, fieldId)).orderBy(asc(fieldLogos.id)), loadParameters(ctx.db)]);
  const frame = frameOf(field.geometry);
  return { fieldId, fieldName: field.name, ...frame, logos: rows.map((r) => logoAnswer(r, frame, params.lines.firstCoat)), caution: LOGO_PIGMENT_CAUTION };
}

/** One logo of a field the caller may read, with the field's name and frame. */
export async function getFieldLogo(ctx: Ctx, fieldId: number, logoId: number) {
  const field = await getField(ctx, fieldId);
  const [row] = await ctx.db.select().from(fieldLogos).where(and(eq(fieldLogos.id, logoId), eq(fieldLogos.fieldId, fieldId)));
  if (!row) throw errors.notFound('field_logo', logoId);
  const params = await loadParameters(ctx.db);
  const frame = frameOf(field.geometry);
  return { field: { id: field.id, name: field.name, ...frame }, row, logo: logoAnswer(row, frame, params.lines.firstCoat) };
}

/**
 * Stores an uploaded logo placed at the field's centre, a fifth of the field's length wide
 * (2 to 10 m), unturned, on a 1 m grid (common practice for hand-painted logos).
 */
export async function addFieldLogo(ctx: Ctx, fieldId: number, input: CreateLogoInput, buffer: Buffer, uploadsDir: string): Promise<FieldLogo<Date>> {
  const field = await authorizeFieldWrite(ctx, fieldId);
  const [{ n } = { n: 0 }] = await ctx.db.select({ n: count() }).from(fieldLogos).where(eq(fieldLogos.fieldId, fieldId));
  if (n >= LOGOS_PER_FIELD) throw appError('field_logo/too_many', `A field keeps at most ${LOGOS_PER_FIELD} logos; this one has ${n}. Remove one first`);
  const logo = await readLogo(buffer);
  const frame = frameOf(field.geometry);
  const base = `logo${fieldId}-${randomUUID()}`;
  const fileName = `${base}.${logo.ext}`;
  const renderName = `${base}.render.png`;
  await fs.mkdir(uploadsDir, { recursive: true });
  await fs.writeFile(path.join(uploadsDir, fileName), logo.stored);
  await fs.writeFile(path.join(uploadsDir, renderName), logo.render);
  const widthM = Math.round(Math.min(10, Math.max(2, frame.lengthM / 5)) * 10) / 10;
  try {
    return await (ctx.db as Db).transaction(async (tx) => {
      const [row] = await tx
        .insert(fieldLogos)
        .values({
          fieldId,
          name: input.name,
          fileName,
          renderName,
          mime: logo.mime,
          pixelWidth: logo.pixelWidth,
          pixelHeight: logo.pixelHeight,
          centerXM: Math.round((frame.lengthM / 2) * 100) / 100,
          centerYM: Math.round((frame.widthM / 2) * 100) / 100,
          widthM,
          rotationDeg: 0,
          gridSpacingM: 1,
          colours: logo.palette.colours,
          backgroundHex: logo.palette.backgroundHex,
          createdBy: ctx.actor.id,
        })
        .returning();
      await writeAudit(tx, { actorId: ctx.actor.id, action: 'create', entity: 'field_logo', entityId: row!.id, districtId: field.districtId, before: null, after: row! });
      const params = await loadParameters(tx);
      return logoAnswer(row!, frame, params.lines.firstCoat);
    });
  } catch (err) {
    await Promise.all([fs.rm(path.join(uploadsDir, fileName), { force: true }), fs.rm(path.join(uploadsDir, renderName), { force: true })]);
    throw err;
  }
}

async function logoOfField(tx: Queryable, fieldId: number, logoId: number) {
  const [row] = await tx.select().from(fieldLogos).where(and(eq(fieldLogos.id, logoId), eq(fieldLogos.fieldId, fieldId)));
  if (!row) throw errors.notFound('field_logo', logoId);
  return row;
}

/** Moves, scales, turns or renames a logo at the version read; the grid must fit the logo. */
export async function updateFieldLogo(ctx: Ctx, fieldId: number, logoId: number, input: UpdateLogoInput): Promise<FieldLogo<Date>> {
  return (ctx.db as Db).transaction(async (tx) => {
    const field = await authorizeFieldWrite(ctx, fieldId, tx);
    const before = await logoOfField(tx, fieldId, logoId);
    if (before.version !== input.version) throw errors.versionConflict('field_logo');
    const { version, ...changes } = input;
    const next = { ...before, ...changes };
    try {
      logoGrid({ centerXM: next.centerXM, centerYM: next.centerYM, widthM: next.widthM, heightM: logoHeightM(next.widthM, next.pixelWidth, next.pixelHeight), rotationDeg: next.rotationDeg }, next.gridSpacingM);
    } catch (err) {
      if (err instanceof DomainError) throw errors.invalid(err.message, [{ path: 'body.gridSpacingM', message: err.message }]);
      throw err;
    }
    const [after] = await tx
      .update(fieldLogos)
      .set({ ...changes, version: version + 1, updatedAt: new Date() })
      .where(and(eq(fieldLogos.id, logoId), eq(fieldLogos.version, version)))
      .returning();
    if (!after) throw errors.versionConflict('field_logo');
    await writeAudit(tx, { actorId: ctx.actor.id, action: 'update', entity: 'field_logo', entityId: logoId, districtId: field.districtId, before, after });
    const params = await loadParameters(tx);
    return logoAnswer(after, frameOf(field.geometry), params.lines.firstCoat);
  });
}

/** Removes a logo at the version read, and its files. */
export async function removeFieldLogo(ctx: Ctx, fieldId: number, logoId: number, version: number, uploadsDir: string): Promise<void> {
  const before = await (ctx.db as Db).transaction(async (tx) => {
    const field = await authorizeFieldWrite(ctx, fieldId, tx);
    const row = await logoOfField(tx, fieldId, logoId);
    const gone = await tx.delete(fieldLogos).where(and(eq(fieldLogos.id, logoId), eq(fieldLogos.version, version))).returning({ id: fieldLogos.id });
    if (!gone.length) throw errors.versionConflict('field_logo');
    await writeAudit(tx, { actorId: ctx.actor.id, action: 'delete', entity: 'field_logo', entityId: logoId, districtId: field.districtId, before: row, after: null });
    return row;
  });
  await Promise.all([fs.rm(path.join(uploadsDir, path.basename(before.fileName)), { force: true }), fs.rm(path.join(uploadsDir, path.basename(before.renderName)), { force: true })]);
}

/** The PNG rendering of a logo, for a caller who may read the field. */
export async function logoRenderFile(ctx: Ctx, fieldId: number, logoId: number, uploadsDir: string) {
  const { row } = await getFieldLogo(ctx, fieldId, logoId);
  const file = path.join(uploadsDir, path.basename(row.renderName));
  try {
    await fs.access(file);
  } catch {
    throw appError('field_logo/file_missing', 'The logo’s picture is missing from the server’s uploads folder');
  }
  return file;
}
