/** A field's stripe pattern: read it with the mowers it may be planned for, set or clear it. */
import { Router } from 'express';
import { idParamSchema, setFieldStripesSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { authorize } from '../services/context.ts';
import { authorizeStripesWrite, getFieldStripes, setFieldStripes } from '../services/stripes.ts';

export function stripesRouter({ db }: AppDeps): Router {
  const router = Router();

  router.get('/:id/stripes', async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json({ stripes: await getFieldStripes(ctxOf(db, req), id) });
  });

  router.patch('/:id/stripes', async (req, res) => {
    const ctx = ctxOf(db, req);
    // A crew lead or a partner is refused before anything is read; a foreman of another
    // district once the field's scope is known, still before the body.
    authorize(ctx, 'update', 'Field');
    const { id } = parse(idParamSchema, req.params, 'params');
    await authorizeStripesWrite(ctx, id);
    res.json({ stripes: await setFieldStripes(ctx, id, parse(setFieldStripesSchema, req.body, 'body')) });
  });

  return router;
}
