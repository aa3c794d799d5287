/** Read-only lists: districts and the audit log. */
import { Router } from 'express';
import { z } from 'zod';
import { idSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { listAudit } from '../services/audit.ts';
import { listDistricts } from '../services/districts.ts';

export const auditQuerySchema = z.object({
  entity: z.string().trim().max(40).optional(),
  entityId: idSchema.optional(),
  limit: z.coerce.number().int().min(1).max(1000).default(200),
});

export function directoryRouter({ db }: AppDeps): Router {
  const router = Router();

  router.get('/districts', async (req, res) => {
    res.json({ items: await listDistricts(ctxOf(db, req)) });
  });

  router.get('/audit', async (req, res) => {
    const query = parse(auditQuerySchema, req.query, 'query');
    res.json({ items: await listAudit(ctxOf(db, req), query) });
  });

  return router;
}
