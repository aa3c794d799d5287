import { Router } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { AppError, acceptInviteSchema, forgotPasswordSchema, resetPasswordSchema, signInSchema, updateProfileSchema } from '@swardwise/domain';
import type { Request } from 'express';
import type { AppDeps } from '../app.ts';
import { ctxOf, requireUser } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { passwordResetMail } from '../mail/messages.ts';
import { acceptInvite, requestPasswordReset, resetPassword, updateProfile, verifyCredentials, type SessionUser } from '../services/users.ts';

/** Starts a fresh session for the user (a new id, so a session id cannot be fixed in advance). */
function startSession(req: Request, user: SessionUser): Promise<void> {
  return new Promise((resolve, reject) => {
    req.session.regenerate((err) => {
      if (err) return reject(err);
      req.session.userId = user.id;
      req.session.save((saveErr) => (saveErr ? reject(saveErr) : resolve()));
    });
  });
}

export function authRouter({ db, config, mailer, clock }: AppDeps): Router {
  const router = Router();
  // The session answer carries the department's time zone: the portal's "today" is its local date.
  const session = (user: SessionUser) => ({ user, timeZone: clock.timeZone });

  const signInLimiter = rateLimit({
    windowMs: config.loginWindowMs,
    limit: config.loginAttempts,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    // Per address and account, so one noisy address cannot lock out everyone.
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String((req.body as { email?: unknown } | undefined)?.email ?? '').toLowerCase()}`,
    skipSuccessfulRequests: true,
    handler: (_req, _res, next) => {
      next(new AppError('rate_limited', 'auth/rate_limited', 'Too many sign-in attempts; wait a few minutes and try again'));
    },
  });

  router.post('/sign-in', signInLimiter, async (req, res) => {
    const input = parse(signInSchema, req.body, 'body');
    const user = await verifyCredentials(db, input.email, input.password);
    await startSession(req, user);
    res.json(session(user));
  });

  router.post('/sign-out', (req, res, next) => {
    req.session.destroy((err) => {
      if (err) return next(err);
      res.clearCookie(config.cookieName, { path: '/' });
      res.status(204).end();
    });
  });

  router.get('/me', requireUser, (req, res) => {
    res.json(session(req.user!));
  });

  router.patch('/me', requireUser, async (req, res) => {
    const input = parse(updateProfileSchema, req.body, 'body');
    const user = await updateProfile(ctxOf(db, req), input);
    res.json(session(user));
  });

  router.post('/accept-invite', signInLimiter, async (req, res) => {
    const input = parse(acceptInviteSchema, req.body, 'body');
    const user = await acceptInvite(db, input.token, input.password);
    await startSession(req, user);
    res.json(session(user));
  });

  // The same answer whether or not the account exists, so the form cannot be used to probe e-mails.
  router.post('/forgot-password', signInLimiter, async (req, res) => {
    const { email } = parse(forgotPasswordSchema, req.body, 'body');
    const reset = await requestPasswordReset(db, email, config.publicUrl);
    if (reset) await mailer.send(passwordResetMail(reset.user.email, reset.user.name, reset.url));
    res.status(202).json({ message: 'If that address has an account, a reset link is on its way.' });
  });

  router.post('/reset-password', signInLimiter, async (req, res) => {
    const input = parse(resetPasswordSchema, req.body, 'body');
    const user = await resetPassword(db, input.token, input.password);
    await startSession(req, user);
    res.json(session(user));
  });

  return router;
}
