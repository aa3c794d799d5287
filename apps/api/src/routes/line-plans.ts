/** A field's line plan: read it, save it, and print its set-out sheet. */
import { Router } from 'express';
import { z } from 'zod';
import { idParamSchema, setFieldLinePlanSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { authorize } from '../services/context.ts';
import { authorizeLinePlanWrite, getFieldLinePlan, setFieldLinePlan, setOutPdf } from '../services/line-plans.ts';

export const setOutQuerySchema = z.object({
  season: z.string().regex(/^\d{4}$/, 'season must be a four-digit year').optional(),
  paper: z.enum(['a4', 'letter'], { error: 'paper must be a4 or letter' }).default('a4'),
});

export function linePlansRouter({ db }: AppDeps): Router {
  const router = Router();

  router.get('/:id/lines', async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json({ linePlan: await getFieldLinePlan(ctxOf(db, req), id) });
  });

  router.patch('/:id/lines', async (req, res) => {
    const ctx = ctxOf(db, req);
    // A crew lead or a partner is refused before anything is read; a foreman of another
    // district once the field's scope is known, still before the body.
    authorize(ctx, 'update', 'Field');
    const { id } = parse(idParamSchema, req.params, 'params');
    await authorizeLinePlanWrite(ctx, id);
    res.json({ linePlan: await setFieldLinePlan(ctx, id, parse(setFieldLinePlanSchema, req.body, 'body')) });
  });

  router.get('/:id/lines/set-out.pdf', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    const q = parse(setOutQuerySchema, req.query, 'query');
    const season = q.season ?? ctx.clock.today().slice(0, 4);
    const pdf = await setOutPdf(ctx, id, season, q.paper === 'letter' ? 'LETTER' : 'A4');
    res.type('application/pdf').setHeader('Content-Disposition', `attachment; filename="set-out-field-${id}-${season}.pdf"`);
    res.send(pdf);
  });

  return router;
}
