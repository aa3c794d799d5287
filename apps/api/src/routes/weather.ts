import { Router } from 'express';
import { z } from 'zod';
import { idParamSchema, weatherRangeSchema, appError } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { receiveUpload } from '../http/uploads.ts';
import { parse } from '../http/validate.ts';
import { authorize } from '../services/context.ts';
import { listDays, listStations, pullFromService, uploadStationCsv } from '../services/weather.ts';

/** `commit=false` (the default) only checks the file and shows its rows; `true` saves them. */
export const csvQuerySchema = z.object({ commit: z.enum(['true', 'false']).default('false') });
export const MAX_CSV_BYTES = 2 * 1024 * 1024;
// A station file and nothing else (commit is in the query).
const receiveFile = receiveUpload({ field: 'file', maxFileBytes: MAX_CSV_BYTES, maxFields: 0, code: 'weather', what: 'The station file' });

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

  router.post(
    '/stations/:id/csv',
    // Who may load weather, and a sound query, before reading a (possibly large) upload.
    (req, _res, next) => {
      authorize(ctxOf(db, req), 'create', 'Weather');
      parse(idParamSchema, req.params, 'params');
      parse(csvQuerySchema, req.query, 'query');
      next();
    },
    receiveFile,
    async (req, res) => {
      const ctx = ctxOf(db, req);
      const { id } = parse(idParamSchema, req.params, 'params');
      const { commit } = parse(csvQuerySchema, req.query, 'query');
      const file = req.file;
      if (!file) throw appError('weather/no_file', 'Choose a station file (.csv) to upload');
      if (!/\.csv$/i.test(file.originalname) || file.buffer.includes(0)) {
        throw appError('weather/not_csv', 'A station file must be a .csv text file');
      }
      res.json(await uploadStationCsv(ctx, id, file.buffer.toString('utf8'), commit === 'true'));
    },
  );

  router.post('/stations/:id/pull', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    const { from, to } = parse(weatherRangeSchema, req.body, 'body');
    res.json(await pullFromService(ctx, id, from, to, settings));
  });

  return router;
}
