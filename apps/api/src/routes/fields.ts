import { Router } from 'express';
import { z } from 'zod';
import { createFieldSchema, idParamSchema, listQuerySchema, needsQuerySchema, updateFieldSchema, versionSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { createField, deleteField, getField, listFieldsJson, updateField } from '../services/fields.ts';
import { fieldNeeds } from '../services/needs.ts';

export const deleteQuerySchema = z.object({ version: z.coerce.number().pipe(versionSchema) });

export function fieldsRouter({ db, config }: AppDeps): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    const query = parse(listQuerySchema, req.query, 'query');
    res.type('application/json').send(await listFieldsJson(ctxOf(db, req), query));
  });

  router.post('/', async (req, res) => {
    const ctx = ctxOf(db, req);
    const input = parse(createFieldSchema, req.body, 'body');
    res.status(201).json({ field: await createField(ctx, input) });
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

  router.patch('/:id', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    const input = parse(updateFieldSchema, req.body, 'body');
    res.json({ field: await updateField(ctx, id, input) });
  });

  router.delete('/:id', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    const { version } = parse(deleteQuerySchema, req.query, 'query');
    await deleteField(ctx, id, version, config.uploadsDir);
    res.status(204).end();
  });

  return router;
}
