/** One work order as a crew works it: read it, report on it, add and show its photos. */
import { Router } from 'express';
import { z } from 'zod';
import { applicationSchema, fieldCheckSchema, idParamSchema, idSchema, reopenSchema, workReportSchema, appError } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { receiveUpload } from '../http/uploads.ts';
import { parse } from '../http/validate.ts';
import { addWorkPhoto, PHOTO_MAX_BYTES, photoFile } from '../services/work-photos.ts';
import { logFieldCheck } from '../services/field-checks.ts';
import { recordApplication } from '../services/applications.ts';
import { getWorkOrder, orderFor, reopenWork, reportWork } from '../services/work-reports.ts';
import { finishRequestsOf, reopenRequestsOf } from '../services/requests.ts';

// The photo and the phone's reference for it.
const receivePhoto = receiveUpload({ field: 'photo', maxFileBytes: PHOTO_MAX_BYTES, maxFields: 1, code: 'work_photo', what: 'The photo' });

export const photoParamsSchema = z.object({ id: idSchema, photoId: idSchema });
export const photoBodySchema = z.object({
  clientRef: z.string().trim().min(8).max(64).regex(/^[A-Za-z0-9_-]+$/, 'a client reference uses letters, digits, - and _').optional(),
});

export function workReportsRouter({ db, config, mailer, background }: AppDeps): Router {
  const router = Router();
  const requestDeps = { mailer, publicUrl: config.publicUrl, background };

  router.get('/:id', async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json(await getWorkOrder(ctxOf(db, req), id));
  });

  router.post('/:id/reports', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    const input = parse(workReportSchema, req.body, 'body');
    const answer = await reportWork(ctx, id, input);
    // A partner's request whose work this finishes is done too.
    if (answer.order.status === 'done' && !answer.duplicate) await finishRequestsOf(ctx, requestDeps, id);
    res.status(answer.duplicate ? 200 : 201).json(answer);
  });

  router.post('/:id/field-check', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    await orderFor(ctx, id, 'log');
    res.status(201).json(await logFieldCheck(ctx, id, parse(fieldCheckSchema, req.body, 'body')));
  });

  router.post('/:id/application', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    // Who may log on this order is checked before the body is read.
    await orderFor(ctx, id, 'log');
    res.status(201).json({ application: await recordApplication(ctx, id, parse(applicationSchema, req.body, 'body')) });
  });

  router.post('/:id/reopen', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    const answer = await reopenWork(ctx, id, parse(reopenSchema, req.body ?? {}, 'body'));
    // A partner's request this order had finished is scheduled again.
    await reopenRequestsOf(ctx, requestDeps, id);
    res.json(answer);
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
        throw appError('work_photo/no_file', 'Choose a photo to upload', { issues: [{ path: 'body.photo', message: 'choose a photo' }] });
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
