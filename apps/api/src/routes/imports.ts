import { Router } from 'express';
import { z } from 'zod';
import { createImportSchema, idParamSchema, IMPORT_MAX_BYTES, appError } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { receiveUpload } from '../http/uploads.ts';
import { parse } from '../http/validate.ts';
import { authorize } from '../services/context.ts';
import { commitImport, getImport, listImports, previewImport, undoImport } from '../services/imports.ts';

export const listQuerySchema = z.object({ limit: z.coerce.number().int().min(1).max(100).default(20) });

// The file and its kind.
const receiveFile = receiveUpload({ field: 'file', maxFileBytes: IMPORT_MAX_BYTES, maxFields: 1, code: 'import', what: 'The file' });

export function importsRouter({ db, config }: AppDeps): Router {
  const router = Router();
  // Refuse roles before reading a (possibly large) upload.
  router.use((req, _res, next) => {
    authorize(ctxOf(db, req), 'create', 'Import');
    next();
  });

  router.get('/', async (req, res) => {
    const { limit } = parse(listQuerySchema, req.query, 'query');
    res.json(await listImports(ctxOf(db, req), limit));
  });

  router.post('/', receiveFile, async (req, res) => {
    const ctx = ctxOf(db, req);
    const { kind } = parse(createImportSchema, req.body, 'body');
    if (!req.file) throw appError('import/no_file', 'Choose a file to upload', { issues: [{ path: 'body.file', message: 'choose a file' }] });
    res.status(201).json({ import: await previewImport(ctx, kind, { originalname: req.file.originalname, buffer: req.file.buffer }) });
  });

  router.get('/:id', async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json({ import: await getImport(ctxOf(db, req), id) });
  });

  router.post('/:id/commit', async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json({ import: await commitImport(ctxOf(db, req), id) });
  });

  router.post('/:id/undo', async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json({ import: await undoImport(ctxOf(db, req), id, config.uploadsDir) });
  });

  return router;
}
