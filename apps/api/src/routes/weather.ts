import { Router } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { AppError, idParamSchema, weatherRangeSchema } from '@swardwise/domain';
import type { AppDeps } from '../app.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { listDays, listStations, pullFromService, uploadStationCsv } from '../services/weather.ts';

export const MAX_CSV_BYTES = 2 * 1024 * 1024;
/** `commit=false` (the default) only checks the file and shows its rows; `true` saves them. */
export const csvQuerySchema = z.object({ commit: z.enum(['true', 'false']).default('false') });
const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_CSV_BYTES, files: 1 } });

/** multer's own errors become our error shape (413 for a file over the limit). */
function receiveFile(req: Parameters<ReturnType<typeof upload.single>>[0], res: Parameters<ReturnType<typeof upload.single>>[1]) {
  return new Promise<void>((resolve, reject) =>
    upload.single('file')(req, res, (err: unknown) => {
      if (!err) return resolve();
      if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE') {
        return reject(new AppError('too_large', 'weather/file_too_large', `The file is over ${MAX_CSV_BYTES / 1024 / 1024} MB`));
      }
      reject(new AppError('invalid', 'weather/upload_failed', err instanceof Error ? err.message : 'The upload failed'));
    }),
  );
}

export function weatherRouter({ db, config }: AppDeps): Router {
  const router = Router();
  const settings = config.weatherApiUrl ? { baseUrl: config.weatherApiUrl, apiKey: config.weatherApiKey ?? '', timeoutMs: config.weatherTimeoutMs } : null;

  router.get('/stations', async (req, res) => {
    res.json({ items: await listStations(ctxOf(db, req)), service: Boolean(settings) });
  });

  router.get('/stations/:id/days', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    const { from, to } = parse(weatherRangeSchema, req.query, 'query');
    res.json(await listDays(ctx, id, from, to));
  });

  router.post('/stations/:id/csv', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    const { commit } = parse(csvQuerySchema, req.query, 'query');
    await receiveFile(req, res);
    const file = req.file;
    if (!file) throw new AppError('invalid', 'weather/no_file', 'Choose a station file (.csv) to upload');
    if (!/\.csv$/i.test(file.originalname) || file.buffer.includes(0)) {
      throw new AppError('unsupported', 'weather/not_csv', 'A station file must be a .csv text file');
    }
    res.json(await uploadStationCsv(ctx, id, file.buffer.toString('utf8'), commit === 'true'));
  });

  router.post('/stations/:id/pull', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    const { from, to } = parse(weatherRangeSchema, req.body, 'body');
    res.json(await pullFromService(ctx, id, from, to, settings));
  });

  return router;
}
