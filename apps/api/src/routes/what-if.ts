/** What-if previews of a season: nothing is saved. */
import { Router } from 'express';
import { whatIfSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { authorize } from '../services/context.ts';
import { previewWhatIf } from '../services/what-if.ts';

export function whatIfRouter({ db }: AppDeps): Router {
  const router = Router();

  router.post('/', async (req, res) => {
    const ctx = ctxOf(db, req);
    // Who is asking, before the body is read; the scenario's district and fields are checked with it.
    authorize(ctx, 'read', 'Budget');
    res.json(await previewWhatIf(ctx, parse(whatIfSchema, req.body, 'body')));
  });

  return router;
}
