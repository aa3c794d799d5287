/** One work order as a crew works it: read it, report on it, add and show its photos. */
import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { AppError, idParamSchema, idSchema, workReportSchema } from '@swardwise/domain';
import type { AppDeps } from '../app.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { addWorkPhoto, PHOTO_MAX_BYTES, photoFile } from '../services/work-photos.ts';
import { getWorkOrder, orderFor, reportWork } from '../services/work-reports.ts';

const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: PHOTO_MAX_BYTES, files: 1, fields: 5 } }).single('photo');

/** Multer's errors carry a code, not a status; give each a clear message and its 4xx. */
const receivePhoto: RequestHandler = (req, res, next) => {
  upload(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') {
        return next(new AppError('too_large', 'work_photo/too_large', `The photo is larger than ${PHOTO_MAX_BYTES / 1024 / 1024} MB; choose a smaller one`));
      }
      return next(new AppError('invalid', 'work_photo/bad_upload', `Send one photo in the form field “photo” (${err.message})`));
    }
    next(new AppError('invalid', 'work_photo/bad_upload', 'The upload could not be read; send the photo as multipart/form-data in the field “photo”'));
  });
};

export const photoParamsSchema = z.object({ id: idSchema, photoId: idSchema });
export const photoBodySchema = z.object({
  clientRef: z.string().trim().min(8).max(64).regex(/^[A-Za-z0-9_-]+$/, 'a client reference uses letters, digits, - and _').optional(),
});

export function workReportsRouter({ db, config }: AppDeps): Router {
  const router = Router();

  router.get('/:id', async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json(await getWorkOrder(ctxOf(db, req), id));
  });

  router.post('/:id/reports', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    const input = parse(workReportSchema, req.body, 'body');
    const answer = await reportWork(ctx, id, input);
    res.status(answer.duplicate ? 200 : 201).json(answer);
  });

  router.post(
    '/:id/photos',
    // Refuse a caller who may not log this order before reading a (possibly large) upload.
    async (req, _res, next) => {
      const { id } = parse(idParamSchema, req.params, 'params');
      await orderFor(ctxOf(db, req), id, 'log');
      next();
    },
    receivePhoto,
    async (req, res) => {
      const ctx = ctxOf(db, req);
      const { id } = parse(idParamSchema, req.params, 'params');
      const { clientRef } = parse(photoBodySchema, req.body, 'body');
      if (!req.file) {
        throw new AppError('invalid', 'work_photo/no_file', 'Choose a photo to upload', { issues: [{ path: 'body.photo', message: 'choose a photo' }] });
      }
      const answer = await addWorkPhoto(ctx, id, { buffer: req.file.buffer, clientRef }, config.uploadsDir);
      res.status(answer.duplicate ? 200 : 201).json(answer);
    },
  );

  router.get('/:id/photos/:photoId', async (req, res) => {
    const { id, photoId } = parse(photoParamsSchema, req.params, 'params');
    const { file, mime } = await photoFile(ctxOf(db, req), id, photoId, config.uploadsDir);
    res.setHeader('Cache-Control', 'private, max-age=86400');
    res.type(mime).sendFile(file);
  });

  return router;
}
