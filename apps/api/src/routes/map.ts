import { Router } from 'express';
import { mapQuerySchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { parse } from '../http/validate.ts';
import { basemap, mapDataJson } from '../services/map.ts';
import { jsonRoute, jsonTextRoute } from './json-routes.ts';

export function mapRouter({ db, config }: AppDeps): Router {
  const router = Router();

  router.get('/', jsonTextRoute(db, (ctx, req) => mapDataJson(ctx, parse(mapQuerySchema, req.query, 'query'))));
  router.get('/basemap', jsonRoute(db, (ctx) => basemap(ctx, config)));

  return router;
}
