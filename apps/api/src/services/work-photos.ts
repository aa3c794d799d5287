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
import { appError, errors, type PhotoAnswer } from '@swardwise/domain';
import type { Db } from '../db/client.ts';
import { workPhotos } from '../db/schema/index.ts';
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

export interface PhotoUpload {
  buffer: Buffer;
  /** The phone's reference for this photo, so a retried upload is stored once. */
  clientRef?: string | undefined;
}

const photoUrl = (orderId: number, photoId: number) => `/api/work-orders/${orderId}/photos/${photoId}`;

function answer(orderId: number, row: { id: number; width: number; height: number; bytes: number; createdAt: Date }, duplicate: boolean) {
  return { photo: { id: row.id, width: row.width, height: row.height, bytes: row.bytes, createdAt: row.createdAt, url: photoUrl(orderId, row.id) }, duplicate };
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

export async function addWorkPhoto(ctx: Ctx, orderId: number, upload: PhotoUpload, uploadsDir: string): Promise<PhotoAnswer<Date>> {
  const order = await orderFor(ctx, orderId, 'log');
  // A stable name per (order, phone reference): a retried upload finds its first copy.
  const fileName = upload.clientRef
    ? `wo${orderId}-${createHash('sha256').update(upload.clientRef).digest('hex').slice(0, 24)}.jpg`
    : `wo${orderId}-${randomUUID()}.jpg`;
  const [earlier] = await ctx.db.select().from(workPhotos).where(and(eq(workPhotos.workOrderId, orderId), eq(workPhotos.fileName, fileName)));
  if (earlier) return answer(orderId, earlier, true);
  const [{ n } = { n: 0 }] = await ctx.db.select({ n: count() }).from(workPhotos).where(eq(workPhotos.workOrderId, orderId));
  if (n >= PHOTOS_PER_ORDER) {
    throw appError('work_photo/too_many', `A work order keeps at most ${PHOTOS_PER_ORDER} photos; this one has ${n}`);
  }

  const image = await readImage(upload.buffer);
  await fs.mkdir(uploadsDir, { recursive: true });
  const file = path.join(uploadsDir, fileName);
  await fs.writeFile(file, image.data);
  try {
    return await (ctx.db as Db).transaction(async (tx) => {
      const [row] = await tx
        .insert(workPhotos)
        .values({ workOrderId: orderId, fileName, mime: 'image/jpeg', width: image.info.width, height: image.info.height, bytes: image.data.length, createdBy: ctx.actor.id })
        .onConflictDoNothing({ target: [workPhotos.workOrderId, workPhotos.fileName] })
        .returning();
      if (!row) {
        // The same upload arrived twice at once: the first one stored it (same bytes, same file).
        const [first] = await tx.select().from(workPhotos).where(and(eq(workPhotos.workOrderId, orderId), eq(workPhotos.fileName, fileName)));
        return answer(orderId, first!, true);
      }
      await writeAudit(tx, { actorId: ctx.actor.id, action: 'create', entity: 'work_photo', entityId: row!.id, districtId: order.districtId, before: null, after: row! });
      return answer(orderId, row!, false);
    });
  } catch (err) {
    // A retry name may already belong to a stored photo: remove the file only if no row has it.
    const [kept] = await ctx.db.select({ id: workPhotos.id }).from(workPhotos).where(and(eq(workPhotos.workOrderId, orderId), eq(workPhotos.fileName, fileName)));
    if (!kept) await fs.rm(file, { force: true });
    throw err;
  }
}

/** Where a photo's file is, for a caller who may read its order. */
export async function photoFile(ctx: Ctx, orderId: number, photoId: number, uploadsDir: string) {
  await orderFor(ctx, orderId, 'read');
  const [photo] = await ctx.db
    .select({ fileName: workPhotos.fileName, mime: workPhotos.mime })
    .from(workPhotos)
    .where(and(eq(workPhotos.id, photoId), eq(workPhotos.workOrderId, orderId)));
  if (!photo) throw errors.notFound('work_photo', photoId);
  const file = path.join(uploadsDir, path.basename(photo.fileName));
  try {
    await fs.access(file);
  } catch {
    throw appError('work_photo/file_missing', 'The photo’s file is missing from the server’s uploads folder');
  }
  return { file, mime: photo.mime };
}
