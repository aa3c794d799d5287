/**
 * The two routes of anything that keeps photos (a work order, a field-page check, a partner's
 * request): add one, and show one. Each router names its params, its ability check and its
 * service; the order of the steps (who may, before the upload is read) is written once here.
 */
import type { RequestHandler } from 'express';
import { z } from 'zod';
import { appError, idSchema } from '@swardwise/domain';
import type { Db } from '../db/client.ts';
import { ctxOf } from '../http/auth.ts';
import { receiveUpload } from '../http/uploads.ts';
import { parse } from '../http/validate.ts';
import type { Ctx } from '../services/context.ts';
import { PHOTO_MAX_BYTES, type PhotoUpload } from '../services/work-photos.ts';

export const photoParamsSchema = z.object({ id: idSchema, photoId: idSchema });
/** The phone's reference for the photo, so a retried upload is stored once. */
export const photoBodySchema = z.object({
  clientRef: z.string().trim().min(8).max(64).regex(/^[A-Za-z0-9_-]+$/, 'a client reference uses letters, digits, - and _').optional(),
});
/** Reads a staff photo (a work order's, a field-page check's) and the phone's reference for it. */
export const receiveStaffPhoto = receiveUpload({ field: 'photo', maxFileBytes: PHOTO_MAX_BYTES, maxFields: 1, code: 'work_photo', what: 'The photo' });

/**
 * The handlers of a photo upload: refuse a caller who may not add one (`allowed`) before the
 * (possibly large) upload is read, read it within `receive`'s limits, then `store` it. A photo
 * the phone sent before (same reference) answers 200 with the stored one, a new one 201.
 */
export function photoUploadHandlers<S extends z.ZodType>(
  db: Db,
  how: {
    params: S;
    allowed: (ctx: Ctx, params: z.infer<S>) => Promise<unknown>;
    receive: RequestHandler;
    /** Names the missing-file error (`work_photo/no_file`, `request_photo/no_file`). */
    code: 'work_photo' | 'request_photo';
    store: (ctx: Ctx, params: z.infer<S>, upload: PhotoUpload) => Promise<{ photo: unknown; duplicate?: boolean }>;
  },
): RequestHandler[] {
  return [
    async (req, _res, next) => {
      await how.allowed(ctxOf(db, req), parse(how.params, req.params, 'params'));
      next();
    },
    how.receive,
    async (req, res) => {
      const params = parse(how.params, req.params, 'params');
      const { clientRef } = parse(photoBodySchema, req.body, 'body');
      if (!req.file) throw appError(`${how.code}/no_file`, 'Choose a photo to upload', { issues: [{ path: 'body.photo', message: 'choose a photo' }] });
      const answer = await how.store(ctxOf(db, req), params, { buffer: req.file.buffer, clientRef });
      res.status(answer.duplicate ? 200 : 201).json(answer);
    },
  ];
}

/**
 * The handler that sends a stored photo to a caller who may see it (`find` checks). Cached a
 * day, privately: a photo's id never gets other bytes, and only the signed-in caller may see it.
 */
export function photoFileHandler<S extends z.ZodType>(db: Db, params: S, find: (ctx: Ctx, params: z.infer<S>) => Promise<{ file: string; mime: string }>): RequestHandler {
  return async (req, res) => {
    const { file, mime } = await find(ctxOf(db, req), parse(params, req.params, 'params'));
    res.setHeader('Cache-Control', 'private, max-age=86400');
    res.type(mime).sendFile(file);
  };
}
