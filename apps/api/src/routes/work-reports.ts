/** One work order as a crew works it: read it, report on it, add and show its photos. */
import { Router } from 'express';
import { applicationSchema, fieldCheckSchema, idParamSchema, reopenSchema, workReportSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { jsonRoute } from './json-routes.ts';
import { photoFileHandler, photoParamsSchema, photoUploadHandlers, receiveStaffPhoto } from './photo-routes.ts';
import { addWorkPhoto, photoFile } from '../services/work-photos.ts';
import { logFieldCheck } from '../services/field-checks.ts';
import { recordApplication } from '../services/applications.ts';
import { getWorkOrder, orderFor, reopenWork, reportWork } from '../services/work-reports.ts';
import { finishRequestsOf, reopenRequestsOf } from '../services/requests.ts';

export function workReportsRouter({ db, config, mailer, background }: AppDeps): Router {
  const router = Router();
  const requestDeps = { mailer, publicUrl: config.publicUrl, background };

  router.get('/:id', jsonRoute(db, (ctx, req) => getWorkOrder(ctx, parse(idParamSchema, req.params, 'params').id)));

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
    ...photoUploadHandlers(db, {
      params: idParamSchema,
      allowed: (ctx, { id }) => orderFor(ctx, id, 'log'),
      receive: receiveStaffPhoto,
      code: 'work_photo',
      store: (ctx, { id }, upload) => addWorkPhoto(ctx, id, upload, config.uploadsDir),
    }),
  );

  router.get('/:id/photos/:photoId', photoFileHandler(db, photoParamsSchema, (ctx, { id, photoId }) => photoFile(ctx, id, photoId, config.uploadsDir)));

  return router;
}
