/** The partner's own pages: their fields in plain words (no costs, no internal notes). */
import { Router } from 'express';
import { idParamSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { parse } from '../http/validate.ts';
import { partnerFieldAnswer, partnerFieldsAnswer, partnerPhotoFile } from '../services/partner.ts';
import { jsonRoute } from './json-routes.ts';
import { photoFileHandler, photoParamsSchema } from './photo-routes.ts';

export function partnerRouter({ db, config }: AppDeps): Router {
  const router = Router();

  router.get('/fields', jsonRoute(db, (ctx) => partnerFieldsAnswer(ctx)));
  router.get('/fields/:id', jsonRoute(db, (ctx, req) => partnerFieldAnswer(ctx, parse(idParamSchema, req.params, 'params').id)));

  router.get('/fields/:id/photos/:photoId', photoFileHandler(db, photoParamsSchema, (ctx, { id, photoId }) => partnerPhotoFile(ctx, id, photoId, config.uploadsDir)));

  return router;
}
