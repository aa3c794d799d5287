/** Developer-only routes, mounted only when this process runs the local mail sink (never in production). */
import { Router } from 'express';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { authorize } from '../services/context.ts';

export function devRouter({ db, mailSink }: AppDeps): Router {
  const router = Router();

  router.get('/mail', (req, res) => {
    authorize(ctxOf(db, req), 'manage', 'Settings');
    res.json({ port: mailSink?.port ?? null, items: mailSink?.messages() ?? [] });
  });

  router.delete('/mail', (req, res) => {
    authorize(ctxOf(db, req), 'manage', 'Settings');
    mailSink?.clear();
    res.status(204).end();
  });

  return router;
}
