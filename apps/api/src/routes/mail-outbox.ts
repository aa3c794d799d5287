/** The mail outbox for the head: what is queued or failed, and sending a failed message again. */
import { Router } from 'express';
import { idParamSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxAllowed, ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { MailOutbox } from '../mail/outbox.ts';
import { listOutbox, retryMail } from '../services/mail-outbox.ts';

export function mailOutboxRouter({ db, mailer, background }: AppDeps): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    res.json(await listOutbox(ctxOf(db, req), mailer.enabled));
  });

  router.post('/:id/retry', async (req, res) => {
    // Who is asking, before anything of the request is read.
    const ctx = ctxAllowed(db, req, 'update', 'MailOutbox');
    const { id } = parse(idParamSchema, req.params, 'params');
    const mail = await retryMail(ctx, id);
    if (mailer instanceof MailOutbox) background.run('mail outbox', () => mailer.flush());
    res.json({ mail });
  });

  return router;
}
