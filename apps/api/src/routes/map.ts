import { Router } from 'express';
import { mapQuerySchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { basemap, mapDataJson } from '../services/map.ts';

export function mapRouter({ db, config }: AppDeps): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    const query = parse(mapQuerySchema, req.query, 'query');
    res.type('application/json').send(await mapDataJson(ctxOf(db, req), query));
  });

  router.get('/basemap', async (req, res) => {
    res.json(await basemap(ctxOf(db, req), config));
  });

  return router;
}
