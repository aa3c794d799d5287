/** Partners' requests: file, change, talk, and the foreman's decisions; photos. */
import { Router } from 'express';
import { z } from 'zod';
import {
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
import { ctxAllowed, ctxOf } from '../http/auth.ts';
import { receiveUpload } from '../http/uploads.ts';
import { parse } from '../http/validate.ts';
import { photoFileHandler, photoUploadHandlers } from './photo-routes.ts';
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
    const ctx = ctxAllowed(db, req, 'read', 'Request');
    res.json({ items: await listRequests(ctx, parse(requestListQuerySchema, req.query, 'query')) });
  });

  router.post('/', async (req, res) => {
    // Crews are refused before the body is read; the field's site is checked in the service.
    const ctx = ctxAllowed(db, req, 'create', 'Request');
    res.status(201).json({ request: await createRequest(ctx, deps, parse(createFieldRequestSchema, req.body, 'body')) });
  });

  router.get('/:id', async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json(await getRequest(ctxOf(db, req), id));
  });

  router.patch('/:id', async (req, res) => {
    const ctx = ctxAllowed(db, req, 'update', 'Request');
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json({ request: await updateRequest(ctx, id, parse(updateFieldRequestSchema, req.body, 'body')) });
  });

  router.post('/:id/messages', async (req, res) => {
    const ctx = ctxAllowed(db, req, 'update', 'Request');
    const { id } = parse(idParamSchema, req.params, 'params');
    res.status(201).json(await addMessage(ctx, deps, id, parse(requestMessageSchema, req.body, 'body')));
  });

  const decision = (path: string, run: (ctx: ReturnType<typeof ctxOf>, id: number, body: unknown) => Promise<unknown>) =>
    router.post(`/:id/${path}`, async (req, res) => {
      // Only a foreman (or an administrator) decides; a partner is refused before the body is read.
      const ctx = ctxAllowed(db, req, 'assign', 'Request');
      const { id } = parse(idParamSchema, req.params, 'params');
      res.json({ request: await run(ctx, id, req.body) });
    });
  decision('schedule', (ctx, id, body) => scheduleRequest(ctx, deps, id, parse(scheduleFieldRequestSchema, body, 'body')));
  decision('decline', (ctx, id, body) => declineRequest(ctx, deps, id, parse(declineFieldRequestSchema, body, 'body')));
  decision('close', (ctx, id, body) => closeRequest(ctx, deps, id, parse(closeFieldRequestSchema, body, 'body')));

  router.post(
    '/:id/photos',
    ...photoUploadHandlers(db, {
      params: idParamSchema,
      allowed: (ctx, { id }) => requestFor(ctx, id, 'update'),
      receive: receivePhoto,
      code: 'request_photo',
      store: (ctx, { id }, upload) => addRequestPhoto(ctx, id, upload.buffer, config.uploadsDir),
    }),
  );

  router.get('/:id/photos/:photoId', photoFileHandler(db, requestPhotoParamsSchema, (ctx, { id, photoId }) => requestPhotoFile(ctx, id, photoId, config.uploadsDir)));

  return router;
}
