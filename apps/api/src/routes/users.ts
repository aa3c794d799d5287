import { Router } from 'express';
import { idParamSchema, inviteUserSchema, updateUserSchema } from '@swardwise/domain';
import type { AppDeps } from '../app.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { inviteUser, listUsers, updateUser } from '../services/users.ts';

export function usersRouter({ db, config }: AppDeps): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    res.json({ items: await listUsers(ctxOf(db, req)) });
  });

  router.post('/', async (req, res) => {
    const ctx = ctxOf(db, req);
    const input = parse(inviteUserSchema, req.body, 'body');
    const result = await inviteUser(ctx, input, config.publicUrl);
    res.status(201).json(result);
  });

  router.patch('/:id', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    const input = parse(updateUserSchema, req.body, 'body');
    res.json({ user: await updateUser(ctx, id, input) });
  });

  return router;
}
