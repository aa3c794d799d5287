/** Partners' requests: file, change, talk, and the foreman's decisions; photos. */
import { Router } from 'express';
import { z } from 'zod';
import {
  appError,
  closeFieldRequestSchema,
  createFieldRequestSchema,
  declineFieldRequestSchema,
  idParamSchema,
  idSchema,
  requestListQuerySchema,
  requestMessageSchema,
  scheduleFieldRequestSchema,
  updateFieldRequestSchema,
} from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { receiveUpload } from '../http/uploads.ts';
import { parse } from '../http/validate.ts';
import { authorize } from '../services/context.ts';
import {
  addMessage,
  addRequestPhoto,
  closeRequest,
  createRequest,
  declineRequest,
  getRequest,
  listRequests,
  REQUEST_PHOTO_MAX_BYTES,
  requestFor,
  requestPhotoFile,
  scheduleRequest,
  updateRequest,
  type RequestDeps,
} from '../services/requests.ts';

export const requestPhotoParamsSchema = z.object({ id: idSchema, photoId: idSchema });

const receivePhoto = receiveUpload({ field: 'photo', maxFileBytes: REQUEST_PHOTO_MAX_BYTES, maxFields: 0, code: 'request_photo', what: 'The photo' });

export function requestsRouter({ db, mailer, config, background }: AppDeps): Router {
  const router = Router();
  const deps: RequestDeps = { mailer, publicUrl: config.publicUrl, background };

  router.get('/', async (req, res) => {
    const ctx = ctxOf(db, req);
    authorize(ctx, 'read', 'Request');
    res.json({ items: await listRequests(ctx, parse(requestListQuerySchema, req.query, 'query')) });
  });

  router.post('/', async (req, res) => {
    const ctx = ctxOf(db, req);
    // Crews are refused before the body is read; the field's site is checked in the service.
    authorize(ctx, 'create', 'Request');
    res.status(201).json({ request: await createRequest(ctx, deps, parse(createFieldRequestSchema, req.body, 'body')) });
  });

  router.get('/:id', async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json(await getRequest(ctxOf(db, req), id));
  });

  router.patch('/:id', async (req, res) => {
    const ctx = ctxOf(db, req);
    authorize(ctx, 'update', 'Request');
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json({ request: await updateRequest(ctx, id, parse(updateFieldRequestSchema, req.body, 'body')) });
  });

  router.post('/:id/messages', async (req, res) => {
    const ctx = ctxOf(db, req);
    authorize(ctx, 'update', 'Request');
    const { id } = parse(idParamSchema, req.params, 'params');
    res.status(201).json(await addMessage(ctx, deps, id, parse(requestMessageSchema, req.body, 'body')));
  });

  const decision = (path: string, run: (ctx: ReturnType<typeof ctxOf>, id: number, body: unknown) => Promise<unknown>) =>
    router.post(`/:id/${path}`, async (req, res) => {
      const ctx = ctxOf(db, req);
      // Only a foreman (or an administrator) decides; a partner is refused before the body is read.
      authorize(ctx, 'assign', 'Request');
      const { id } = parse(idParamSchema, req.params, 'params');
      res.json({ request: await run(ctx, id, req.body) });
    });
  decision('schedule', (ctx, id, body) => scheduleRequest(ctx, deps, id, parse(scheduleFieldRequestSchema, body, 'body')));
  decision('decline', (ctx, id, body) => declineRequest(ctx, deps, id, parse(declineFieldRequestSchema, body, 'body')));
  decision('close', (ctx, id, body) => closeRequest(ctx, deps, id, parse(closeFieldRequestSchema, body, 'body')));

  router.post(
    '/:id/photos',
    // Refuse a caller who may not change this request before reading a (possibly large) upload.
    async (req, _res, next) => {
      const { id } = parse(idParamSchema, req.params, 'params');
      await requestFor(ctxOf(db, req), id, 'update');
      next();
    },
    receivePhoto,
    async (req, res) => {
      const { id } = parse(idParamSchema, req.params, 'params');
      if (!req.file) throw appError('request_photo/no_file', 'Choose a photo to upload', { issues: [{ path: 'body.photo', message: 'choose a photo' }] });
      res.status(201).json(await addRequestPhoto(ctxOf(db, req), id, req.file.buffer, config.uploadsDir));
    },
  );

  router.get('/:id/photos/:photoId', async (req, res) => {
    const { id, photoId } = parse(requestPhotoParamsSchema, req.params, 'params');
    const { file, mime } = await requestPhotoFile(ctxOf(db, req), id, photoId, config.uploadsDir);
    res.setHeader('Cache-Control', 'private, max-age=86400');
    res.type(mime).sendFile(file);
  });

  return router;
}
