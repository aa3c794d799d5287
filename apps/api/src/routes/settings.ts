/** Department settings (the time zone); administrators only. */
import { Router } from 'express';
import { updateDepartmentSettingsSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxAllowed, ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { getDepartmentSettings, updateDepartmentSettings } from '../services/settings.ts';

export function settingsRouter({ db, clock }: AppDeps): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    res.json(await getDepartmentSettings(ctxOf(db, req), clock));
  });

  router.patch('/', async (req, res) => {
    // Who is asking, before the body is read.
    const ctx = ctxAllowed(db, req, 'manage', 'Settings');
    res.json(await updateDepartmentSettings(ctx, clock, parse(updateDepartmentSettingsSchema, req.body, 'body')));
  });

  return router;
}
