import { Router, type Request } from 'express';
import { z } from 'zod';
import { createFieldSchema, fieldCheckSchema, idParamSchema, idSchema, listQuerySchema, needsQuerySchema, pageQuerySchema, updateFieldSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { createField, deleteField, fieldRows, getField, listFieldsJson, updateField } from '../services/fields.ts';
import { fieldNeedsJson } from '../services/needs.ts';
import { fieldWorkHistory } from '../services/field-history.ts';
import { addFieldCheckPhoto, checkPhotoAllowed, fieldCheckPhotoFile, fieldForCheck, fieldGrowthCalibration, listFieldChecks, logStaffFieldCheck } from '../services/field-checks.ts';
import { photoFileHandler, photoUploadHandlers, receiveStaffPhoto } from './photo-routes.ts';
import { jsonRoute, jsonTextRoute } from './json-routes.ts';
import { writeRoutes } from './write-routes.ts';

export const checkParamsSchema = z.object({ id: idSchema, checkId: idSchema });
export const checkPhotoParamsSchema = z.object({ id: idSchema, checkId: idSchema, photoId: idSchema });

export function fieldsRouter({ db, config }: AppDeps): Router {
  const router = Router();

  const idOf = (req: Request) => parse(idParamSchema, req.params, 'params').id;

  router.get('/', jsonTextRoute(db, (ctx, req) => listFieldsJson(ctx, parse(listQuerySchema, req.query, 'query'))));
  router.get('/:id', jsonRoute(db, async (ctx, req) => ({ field: await getField(ctx, idOf(req)) })));
  router.get('/:id/needs', jsonTextRoute(db, (ctx, req) => fieldNeedsJson(ctx, idOf(req), parse(needsQuerySchema, req.query, 'query').date)));
  router.get('/:id/work', jsonRoute(db, (ctx, req) => fieldWorkHistory(ctx, idOf(req), parse(pageQuerySchema, req.query, 'query'))));
  router.get('/:id/checks', jsonRoute(db, (ctx, req) => listFieldChecks(ctx, idOf(req))));

  // Staff log a check from the field page: who may is settled before the body is read.
  router.post('/:id/checks', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    await fieldForCheck(ctx, id);
    res.status(201).json(await logStaffFieldCheck(ctx, id, parse(fieldCheckSchema, req.body, 'body')));
  });

  router.post(
    '/:id/checks/:checkId/photos',
    ...photoUploadHandlers(db, {
      params: checkParamsSchema,
      allowed: (ctx, { id, checkId }) => checkPhotoAllowed(ctx, id, checkId),
      receive: receiveStaffPhoto,
      code: 'work_photo',
      store: (ctx, { id, checkId }, upload) => addFieldCheckPhoto(ctx, id, checkId, upload, config.uploadsDir),
    }),
  );

  router.get('/:id/checks/:checkId/photos/:photoId', photoFileHandler(db, checkPhotoParamsSchema, (ctx, { id, checkId, photoId }) => fieldCheckPhotoFile(ctx, id, checkId, photoId, config.uploadsDir)));

  router.get('/:id/growth-calibration', jsonRoute(db, async (ctx, req) => ({ calibration: await fieldGrowthCalibration(ctx, idOf(req)) })));

  writeRoutes(router, db, '/', 'field', {
    guard: fieldRows,
    create: { body: createFieldSchema, run: createField },
    update: { body: updateFieldSchema, run: updateField },
    remove: (ctx, id, version) => deleteField(ctx, id, version, config.uploadsDir),
  });

  return router;
}
