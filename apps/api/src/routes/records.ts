/** Records: planned against actual work over a range of dates. */
import { Router } from 'express';
import { dateRangeQuerySchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { getRecords } from '../services/records.ts';
import { listApplications } from '../services/applications.ts';

export function recordsRouter({ db }: AppDeps): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    res.json(await getRecords(ctxOf(db, req), parse(dateRangeQuerySchema, req.query, 'query')));
  });
  router.get('/applications', async (req, res) => {
    res.json({ applications: await listApplications(ctxOf(db, req), parse(dateRangeQuerySchema, req.query, 'query')) });
  });
  return router;
}
