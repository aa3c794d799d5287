/**
 * Crews' photos of their work. Every upload is decoded and re-encoded by sharp: turned
 * upright by its EXIF orientation, shrunk to at most 1600 px on the long side and saved as a
 * JPEG without metadata (a phone's GPS tag and serial number do not travel with it). The file
 * name is made here; nothing of the client's file name reaches the disk.
 */
import { createHash, randomUUID } from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';
import sharp from 'sharp';
import { and, count, eq } from 'drizzle-orm';
import type { PgColumn } from 'drizzle-orm/pg-core';
import { appError, errors, type PhotoAnswer, type StoredPhoto } from '@swardwise/domain';
import type { Db, Queryable } from '../db/client.ts';
import { workPhotos, type fieldCheckPhotos, type fieldRequestPhotos } from '../db/schema/index.ts';
import { writeAudit } from './audit.ts';
import type { Ctx } from './context.ts';
import { orderFor } from './work-reports.ts';

export const PHOTO_MAX_BYTES = 12 * 1024 * 1024;
export const PHOTOS_PER_ORDER = 6;
const PHOTO_LONG_SIDE_PX = 1600;
const PHOTO_QUALITY = 80;
/** A 12 MB file can still decode to a huge canvas; 50 megapixels is above any phone camera. */
const MAX_INPUT_PIXELS = 50_000_000;
const ACCEPTED_FORMATS = new Set(['jpeg', 'png', 'webp']);
/** The media types a photo upload may be, as the API's document states them. */
export const PHOTO_MEDIA_TYPES = [...ACCEPTED_FORMATS].map((f) => `image/${f}`).join(', ');

export interface PhotoUpload {
  buffer: Buffer;
  /** The phone's reference for this photo, so a retried upload is stored once. */
  clientRef?: string | undefined;
}

const photoUrl = (orderId: number, photoId: number) => `/api/work-orders/${orderId}/photos/${photoId}`;

/** A stored photo row as every photo answer gives it: the columns the contract names (never the file name) and its `url`. */
export function storedPhotoAnswer(row: StoredPhotoColumns, url: string): StoredPhoto<Date> {
  return { id: row.id, width: row.width, height: row.height, bytes: row.bytes, createdAt: row.createdAt, url };
}

/**
 * The real format from the bytes (the browser's mime type is only a claim), turned upright,
 * shrunk and re-encoded as JPEG without metadata. `code` names the errors (a crew's work
 * photo, a partner's request photo).
 */
export async function readImage(buffer: Buffer, code: 'work_photo' | 'request_photo' = 'work_photo') {
  let meta: sharp.Metadata;
  try {
    meta = await sharp(buffer, { limitInputPixels: false }).metadata();
  } catch {
    throw appError(`${code}/not_an_image`, 'This file is not a photo; send a JPEG, PNG or WebP image');
  }
  if (!meta.format || !ACCEPTED_FORMATS.has(meta.format)) {
    throw appError(`${code}/unsupported_format`, `A ${String(meta.format ?? 'file of this kind').toUpperCase()} image cannot be used; send a JPEG, PNG or WebP photo`);
  }
  if ((meta.width ?? 0) * (meta.height ?? 0) > MAX_INPUT_PIXELS) {
    throw appError(`${code}/too_many_pixels`, 'The image is larger than 50 megapixels; send a smaller photo');
  }
  try {
    return await sharp(buffer, { limitInputPixels: MAX_INPUT_PIXELS })
      .rotate()
      .resize({ width: PHOTO_LONG_SIDE_PX, height: PHOTO_LONG_SIDE_PX, fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: PHOTO_QUALITY, mozjpeg: true })
      .toBuffer({ resolveWithObject: true });
  } catch {
    throw appError(`${code}/unreadable`, 'The photo could not be read (the file may be damaged); take it again or choose another');
  }
}

/** The columns every photo table shares, as a stored photo answers with them. */
type StoredPhotoColumns = { id: number; width: number; height: number; bytes: number; createdAt: Date };

/** A file name from the phone's reference (stable, so a retried upload finds its first copy) or a random one. */
export function photoFileName(prefix: string, clientRef: string | undefined): string {
  return clientRef ? `${prefix}-${createHash('sha256').update(clientRef).digest('hex').slice(0, 24)}.jpg` : `${prefix}-${randomUUID()}.jpg`;
}

/** A table of photos that belong to one owner each (a work order, a field check, a request): the stored-photo columns and the owner's key. */
type PhotoTable = typeof workPhotos | typeof fieldCheckPhotos | typeof fieldRequestPhotos;

/** Whose photos a `storePhoto` call adds to, and how the upload is limited and audited. */
export interface PhotoOwner {
  table: PhotoTable;
  /** The owner's key as a row of the table holds it: its column is the table's one of that name. */
  key: { workOrderId: number } | { fieldCheckId: number } | { requestId: number };
  /** The owner in words, for the refusal when it keeps `limit` photos already ("work order"). */
  name: string;
  limit: number;
  /** The audit entry of a stored photo. */
  entity: 'work_photo' | 'field_check_photo' | 'field_request_photo';
  districtId: number | null;
  /** Names the errors, as `readImage` does. */
  code?: 'work_photo' | 'request_photo';
}

/**
 * Stores an upload once among its owner's photos: an earlier row with the same file name
 * answers as a duplicate (the table's unique index holds a name once per owner), the count is
 * checked against `limit`, the image is re-encoded (`readImage`) and written, and the row
 * inserted and audited in one transaction. On a failure the file is removed unless a row
 * already holds that name (a retry of a stored photo). `R` is the row of `owner.table`.
 */
export async function storePhoto<R extends PhotoTable['$inferSelect']>(ctx: Ctx, uploadsDir: string, fileName: string, buffer: Buffer, owner: PhotoOwner): Promise<{ row: R; duplicate: boolean }> {
  const { table } = owner;
  const [[keyName, id]] = Object.entries(owner.key) as [[string, number]];
  const column = (table as unknown as Record<string, PgColumn>)[keyName]!;
  const mine = eq(column, id);
  const find = async (db: Queryable) => (await db.select().from(table).where(and(mine, eq(table.fileName, fileName))))[0] as R | undefined;
  const earlier = await find(ctx.db);
  if (earlier) return { row: earlier, duplicate: true };
  const n = (await ctx.db.select({ n: count() }).from(table).where(mine))[0]?.n ?? 0;
  const code = owner.code ?? 'work_photo';
  if (n >= owner.limit) throw appError(`${code}/too_many`, `A ${owner.name} keeps at most ${owner.limit} photos; this one has ${n}`);

  const image = await readImage(buffer, code);
  await fs.mkdir(uploadsDir, { recursive: true });
  const file = path.join(uploadsDir, fileName);
  await fs.writeFile(file, image.data);
  try {
    return await (ctx.db as Db).transaction(async (tx) => {
      const [row] = (await tx
        .insert(table)
        .values({ ...owner.key, fileName, mime: 'image/jpeg', width: image.info.width, height: image.info.height, bytes: image.data.length, createdBy: ctx.actor.id })
        // The same upload arriving twice at once: the first one stored it.
        .onConflictDoNothing({ target: [column, table.fileName] })
        .returning()) as (R | undefined)[];
      if (!row) return { row: (await find(tx))!, duplicate: true };
      await writeAudit(tx, { actorId: ctx.actor.id, action: 'create', entity: owner.entity, entityId: row.id, districtId: owner.districtId, before: null, after: row });
      return { row, duplicate: false };
    });
  } catch (err) {
    // A retry name may already belong to a stored photo: remove the file only if no row has it.
    if (!(await find(ctx.db))) await fs.rm(file, { force: true });
    throw err;
  }
}

/** The path of a stored photo's file; a clear error when the uploads folder lost it. */
export async function storedPhotoPath(uploadsDir: string, fileName: string, code: 'work_photo' | 'request_photo' = 'work_photo'): Promise<string> {
  const file = path.join(uploadsDir, path.basename(fileName));
  try {
    await fs.access(file);
  } catch {
    throw appError(`${code}/file_missing`, 'The photo’s file is missing from the server’s uploads folder');
  }
  return file;
}

export async function addWorkPhoto(ctx: Ctx, orderId: number, upload: PhotoUpload, uploadsDir: string): Promise<PhotoAnswer<Date>> {
  const order = await orderFor(ctx, orderId, 'log');
  const fileName = photoFileName(`wo${orderId}`, upload.clientRef);
  const { row, duplicate } = await storePhoto<typeof workPhotos.$inferSelect>(ctx, uploadsDir, fileName, upload.buffer, {
    table: workPhotos,
    key: { workOrderId: orderId },
    name: 'work order',
    limit: PHOTOS_PER_ORDER,
    entity: 'work_photo',
    districtId: order.districtId,
  });
  return { photo: storedPhotoAnswer(row, photoUrl(orderId, row.id)), duplicate };
}

/** Where a photo's file is, for a caller who may read its order. */
export async function photoFile(ctx: Ctx, orderId: number, photoId: number, uploadsDir: string) {
  await orderFor(ctx, orderId, 'read');
  const [photo] = await ctx.db
    .select({ fileName: workPhotos.fileName, mime: workPhotos.mime })
    .from(workPhotos)
    .where(and(eq(workPhotos.id, photoId), eq(workPhotos.workOrderId, orderId)));
  if (!photo) throw errors.notFound('work_photo', photoId);
  return { file: await storedPhotoPath(uploadsDir, photo.fileName), mime: photo.mime };
}
