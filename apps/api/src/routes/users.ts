import { Router } from 'express';
import { idParamSchema, inviteUserSchema, updateUserSchema, type InviteAnswer } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { ROLE_LABELS } from '@swardwise/domain';
import { invitationMail } from '../mail/messages.ts';
import { checkUserAttributes, inviteUser, listUsers, updateUser } from '../services/users.ts';

export function usersRouter({ db, config, mailer }: AppDeps): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    res.json({ items: await listUsers(ctxOf(db, req)) });
  });

  router.post('/', async (req, res) => {
    const ctx = ctxOf(db, req);
    const input = parse(inviteUserSchema, req.body, 'body');
    const result = await inviteUser(ctx, input, config.publicUrl);
    const emailed = await mailer.send(invitationMail(result.user.email, result.user.name, ROLE_LABELS[result.user.role].toLowerCase(), result.inviteUrl));
    const answer: InviteAnswer<Date> = { ...result, emailed, mail: emailed ? 'sent' : mailer.enabled ? 'failed' : 'off' };
    res.status(201).json(answer);
  });

  router.patch('/:id', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    // Who may change which attribute is known before the body's values are read.
    const sent = req.body && typeof req.body === 'object' ? Object.keys(req.body as object) : [];
    checkUserAttributes(ctx, { id }, sent);
    const input = parse(updateUserSchema, req.body, 'body');
    res.json({ user: await updateUser(ctx, id, input) });
  });

  return router;
}
