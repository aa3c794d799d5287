/** Closing, restricting and reopening a field, and its history of closures. */
import { Router } from 'express';
import { closeFieldSchema, idParamSchema, reopenFieldSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxAllowed, ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { closeField, getFieldClosures, reopenField, type ClosureDeps } from '../services/closures.ts';

export function closuresRouter({ db, mailer, config, background }: AppDeps): Router {
  const router = Router();
  const deps: ClosureDeps = { mailer, publicUrl: config.publicUrl, background };

  router.get('/:id/closures', async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json({ closures: await getFieldClosures(ctxOf(db, req), id) });
  });

  router.post('/:id/closures', async (req, res) => {
    // A crew lead or a partner is refused before the body is read.
    const ctx = ctxAllowed(db, req, 'create', 'FieldClosure');
    const { id } = parse(idParamSchema, req.params, 'params');
    res.status(201).json(await closeField(ctx, deps, id, parse(closeFieldSchema, req.body, 'body')));
  });

  router.post('/:id/reopen', async (req, res) => {
    const ctx = ctxAllowed(db, req, 'create', 'FieldClosure');
    const { id } = parse(idParamSchema, req.params, 'params');
    res.status(201).json(await reopenField(ctx, deps, id, parse(reopenFieldSchema, req.body, 'body')));
  });

  return router;
}
