import { Router } from 'express';
import { createFieldSchema, idParamSchema, listQuerySchema, needsQuerySchema, pageQuerySchema, updateFieldSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { createField, deleteField, getField, listFieldsJson, updateField } from '../services/fields.ts';
import { fieldNeeds } from '../services/needs.ts';
import { fieldWorkHistory } from '../services/field-history.ts';
import { listFieldChecks } from '../services/field-checks.ts';
import { writeRoutes } from './write-routes.ts';

export function fieldsRouter({ db, config }: AppDeps): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    const query = parse(listQuerySchema, req.query, 'query');
    res.type('application/json').send(await listFieldsJson(ctxOf(db, req), query));
  });

  router.get('/:id', async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json({ field: await getField(ctxOf(db, req), id) });
  });

  router.get('/:id/needs', async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    const { date } = parse(needsQuerySchema, req.query, 'query');
    res.json({ needs: await fieldNeeds(ctxOf(db, req), id, date) });
  });

  router.get('/:id/work', async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json(await fieldWorkHistory(ctxOf(db, req), id, parse(pageQuerySchema, req.query, 'query')));
  });

  router.get('/:id/checks', async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json(await listFieldChecks(ctxOf(db, req), id));
  });

  writeRoutes(router, db, '/', 'field', {
    create: { body: createFieldSchema, run: createField },
    update: { body: updateFieldSchema, run: updateField },
    remove: (ctx, id, version) => deleteField(ctx, id, version, config.uploadsDir),
  });

  return router;
}
