/** The department's costs and rates: the head and administrators set them, a foreman reads them. */
import { Router } from 'express';
import { updateCostSettingsSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxAllowed, ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { getCosts, updateCosts } from '../services/costs.ts';

export function costsRouter({ db }: AppDeps): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    res.json(await getCosts(ctxOf(db, req)));
  });

  router.patch('/', async (req, res) => {
    // Who is asking, before the body is read.
    const ctx = ctxAllowed(db, req, 'update', 'CostSettings');
    res.json(await updateCosts(ctx, parse(updateCostSettingsSchema, req.body, 'body')));
  });

  return router;
}
