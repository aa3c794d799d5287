import { Router } from 'express';
import { createSiteSchema, idParamSchema, listQuerySchema, updateSiteSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { listFields } from '../services/fields.ts';
import { createSite, getSite, listSites, siteRows, updateSite } from '../services/sites.ts';
import { writeRoutes } from './write-routes.ts';

export function sitesRouter({ db }: AppDeps): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    const query = parse(listQuerySchema, req.query, 'query');
    res.json({ items: await listSites(ctxOf(db, req), query) });
  });

  router.get('/:id', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    const site = await getSite(ctx, id);
    res.json({ site, fields: await listFields(ctx, { siteId: id }) });
  });

  writeRoutes(router, db, '/', 'site', {
    guard: siteRows,
    create: { body: createSiteSchema, run: createSite },
    update: { body: updateSiteSchema, run: updateSite },
  });

  return router;
}
