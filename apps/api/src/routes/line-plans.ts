/** A field's line plan: read it, save it, and print its set-out sheet. */
import { Router } from 'express';
import { z } from 'zod';
import { idParamSchema, setFieldLinePlanSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { getFieldLinePlan, setFieldLinePlan, setOutPdf } from '../services/line-plans.ts';
import { fieldSettingRoutes } from './write-routes.ts';

export const setOutQuerySchema = z.object({
  season: z.string().regex(/^\d{4}$/, 'season must be a four-digit year').optional(),
  paper: z.enum(['a4', 'letter'], { error: 'paper must be a4 or letter' }).default('a4'),
});

export function linePlansRouter({ db }: AppDeps): Router {
  const router = Router();

  fieldSettingRoutes(router, db, 'lines', 'linePlan', { get: getFieldLinePlan, body: setFieldLinePlanSchema, set: setFieldLinePlan });

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
