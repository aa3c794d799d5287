/** The department head's overview (a foreman's: his district's). */
import { Router } from 'express';
import { overviewQuerySchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { getOverview } from '../services/overview.ts';

export function overviewRouter({ db }: AppDeps): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    res.json(await getOverview(ctxOf(db, req), parse(overviewQuerySchema, req.query, 'query')));
  });
  return router;
}
