import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { AppError, createImportSchema, idParamSchema, IMPORT_MAX_BYTES } from '@swardwise/domain';
import type { AppDeps } from '../app.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { authorize } from '../services/context.ts';
import { commitImport, getImport, listImports, previewImport, undoImport } from '../services/imports.ts';

export const listQuerySchema = z.object({ limit: z.coerce.number().int().min(1).max(100).default(20) });

const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: IMPORT_MAX_BYTES, files: 1, fields: 10 } }).single('file');

/** Multer's errors carry a code, not a status; give each a clear message and its 4xx. */
const receiveFile: RequestHandler = (req, res, next) => {
  upload(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') {
        return next(new AppError('too_large', 'import/too_large', `The file is larger than ${IMPORT_MAX_BYTES / 1024 / 1024} MB; split it into smaller files`));
      }
      return next(new AppError('invalid', 'import/bad_upload', `Send one file in the form field “file” (${err.message})`));
    }
    next(new AppError('invalid', 'import/bad_upload', 'The upload could not be read; send the file as multipart/form-data in the field “file”'));
  });
};

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
    if (!req.file) throw new AppError('invalid', 'import/no_file', 'Choose a file to upload', { issues: [{ path: 'body.file', message: 'choose a file' }] });
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
