/** A field's stripe pattern: read it with the mowers it may be planned for, set or clear it. */
import { Router } from 'express';
import { setFieldStripesSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { getFieldStripes, setFieldStripes } from '../services/stripes.ts';
import { fieldSettingRoutes } from './write-routes.ts';

export function stripesRouter({ db }: AppDeps): Router {
  const router = Router();
  fieldSettingRoutes(router, db, 'stripes', 'stripes', { get: getFieldStripes, body: setFieldStripesSchema, set: setFieldStripes });
  return router;
}
