import { Router } from 'express';
import { levelParamSchema, updateLevelStandardSchema, type Level } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { listStandards, updateLevelStandard } from '../services/standards.ts';
import { jsonRoute } from './json-routes.ts';

export function standardsRouter({ db }: AppDeps): Router {
  const router = Router();

  router.get('/', jsonRoute(db, (ctx) => listStandards(ctx)));

  router.patch('/:level', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { level } = parse(levelParamSchema, req.params, 'params');
    const input = parse(updateLevelStandardSchema, req.body, 'body');
    res.json({ standard: await updateLevelStandard(ctx, level as Level, input) });
  });

  return router;
}
