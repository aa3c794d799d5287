import { Router } from 'express';
import { z } from 'zod';
import { addDaysIso, idSchema } from '@swardwise/domain';
import type { AppDeps } from '../app.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { listWorkOrders } from '../services/work-orders.ts';

const today = () => new Date().toISOString().slice(0, 10);
const querySchema = z
  .object({
    from: z.iso.date('use a date as YYYY-MM-DD').optional(),
    to: z.iso.date('use a date as YYYY-MM-DD').optional(),
    crewId: idSchema.optional(),
  })
  .transform((q) => ({ ...q, from: q.from ?? today(), to: q.to ?? addDaysIso(q.from ?? today(), 6) }))
  .refine((q) => q.from <= q.to, { path: ['to'], message: 'the end date is before the start date' })
  .refine((q) => (Date.parse(q.to) - Date.parse(q.from)) / 86_400_000 <= 92, { path: ['to'], message: 'ask for at most 92 days at a time' });

export function workOrdersRouter({ db }: AppDeps): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    res.json({ items: await listWorkOrders(ctxOf(db, req), parse(querySchema, req.query, 'query')) });
  });
  return router;
}
