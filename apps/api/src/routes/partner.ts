/** The partner's own pages: their fields in plain words (no costs, no internal notes). */
import { Router } from 'express';
import { idParamSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { partnerFieldAnswer, partnerFieldsAnswer, partnerPhotoFile } from '../services/partner.ts';
import { photoFileHandler, photoParamsSchema } from './photo-routes.ts';

export function partnerRouter({ db, config }: AppDeps): Router {
  const router = Router();

  router.get('/fields', async (req, res) => {
    res.json(await partnerFieldsAnswer(ctxOf(db, req)));
  });

  router.get('/fields/:id', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json(await partnerFieldAnswer(ctx, id));
  });

  router.get('/fields/:id/photos/:photoId', photoFileHandler(db, photoParamsSchema, (ctx, { id, photoId }) => partnerPhotoFile(ctx, id, photoId, config.uploadsDir)));

  return router;
}
