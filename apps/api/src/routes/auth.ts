import { eq } from 'drizzle-orm';
import { Router } from 'express';
import { ipKeyGenerator, rateLimit, type Options } from 'express-rate-limit';
import { AppError, acceptInviteSchema, forgotPasswordSchema, resetPasswordSchema, signInSchema, updateProfileSchema, appError } from '@swardwise/domain';
import type { Request, Response } from 'express';
import type { AppDeps } from '../app-deps.ts';
import { users } from '../db/schema/index.ts';
import { ctxOf, requireUser } from '../http/auth.ts';
import { DrizzleRateLimitStore } from '../http/rate-limit-store.ts';
import { capSessionExpiry } from '../http/session-lifetime.ts';
import { parse } from '../http/validate.ts';
import { passwordResetMail } from '../mail/messages.ts';
import { writeAudit, type AuditAction } from '../services/audit.ts';
import { acceptInvite, requestPasswordReset, resetPassword, updateProfile, verifyCredentials, type SessionUser } from '../services/users.ts';

/** Starts a fresh session for the user (a new id, so a session id cannot be fixed in advance). */
function startSession(req: Request, user: SessionUser, limits: AppDeps['config']): Promise<void> {
  return new Promise((resolve, reject) => {
    req.session.regenerate((err) => {
      if (err) return reject(err);
      req.session.userId = user.id;
      req.session.signedInAt = Date.now();
      capSessionExpiry(req, limits);
      req.session.save((saveErr) => (saveErr ? reject(saveErr) : resolve()));
    });
  });
}

/** The e-mail a request is about, as the schema would normalise it, for counting per account. */
const accountKey = (req: Request) => String((req.body as { email?: unknown } | undefined)?.email ?? '').trim().toLowerCase().slice(0, 254);
/** The client's address; a forwarded one only from the proxy TRUST_PROXY names. */
const addressKey = (req: Request) => ipKeyGenerator(req.ip ?? req.socket.remoteAddress ?? '');

type AuthAction = Extract<AuditAction, 'sign_in' | 'sign_in_failed' | 'sign_out'>;

export function authRouter({ db, config, mailer, background, clock, rateLimitPrefix = '' }: AppDeps): Router {
  const router = Router();
  // The session answer carries the department's time zone: the portal's "today" is its local date.
  const session = (user: SessionUser) => ({ user, timeZone: clock.timeZone });

  // Counted in the database, so every API process behind it counts the same attempts.
  const limiter = (name: string, options: Partial<Options> & { message: string }) =>
    rateLimit({
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      store: new DrizzleRateLimitStore(db, `${rateLimitPrefix}${name}`),
      ...options,
      handler: (_req, _res, next) => next(appError('auth/rate_limited', options.message)),
    });
  const tooManySignIns = 'Too many sign-in attempts; wait a few minutes and try again';
  // Failed attempts per account, from wherever they come (a spread-out guesser is still one guesser)…
  const signInPerAccount = limiter('sign-in-account', { windowMs: config.loginWindowMs, limit: config.loginAttempts, keyGenerator: (req) => `account:${accountKey(req)}`, skipSuccessfulRequests: true, message: tooManySignIns });
  // …and per address, across accounts, invitation and reset links (one address trying many).
  const failuresPerAddress = limiter('failures-address', { windowMs: config.loginWindowMs, limit: config.loginAttemptsPerAddress, keyGenerator: addressKey, skipSuccessfulRequests: true, message: tooManySignIns });
  // Every reset request counts, answered or not, so the form cannot mail-bomb an inbox.
  const tooManyResets = 'Too many password reset requests; wait a while, then use the newest e-mail';
  const resetsPerAccount = limiter('reset-account', { windowMs: config.resetWindowMs, limit: config.resetRequestsPerAccount, keyGenerator: (req) => `reset:${accountKey(req)}`, message: tooManyResets });
  const resetsPerAddress = limiter('reset-address', { windowMs: config.resetWindowMs, limit: config.resetRequestsPerAddress, keyGenerator: addressKey, message: tooManyResets });

  /** Sign-ins, sign-outs and reset requests in the audit log: who, from where; never a password or token. */
  const audit = (req: Request, action: AuthAction, userId: number | null, details: Record<string, unknown> = {}) =>
    writeAudit(db, {
      actorId: action === 'sign_in_failed' ? null : userId,
      action,
      entity: 'account',
      entityId: userId,
      districtId: null,
      before: null,
      after: { ...details, address: req.ip ?? null },
    });

  router.post('/sign-in', failuresPerAddress, signInPerAccount, async (req, res) => {
    const input = parse(signInSchema, req.body, 'body');
    let user: SessionUser;
    try {
      user = await verifyCredentials(db, input.email, input.password);
    } catch (err) {
      if (err instanceof AppError && err.code === 'auth/invalid_credentials') {
        const [known] = await db.select({ id: users.id }).from(users).where(eq(users.email, input.email));
        await audit(req, 'sign_in_failed', known?.id ?? null, { email: input.email });
      }
      throw err;
    }
    await startSession(req, user, config);
    await audit(req, 'sign_in', user.id);
    res.json(session(user));
  });

  router.post('/sign-out', async (req, res, next) => {
    const userId = req.session.userId ?? null;
    if (userId) await audit(req, 'sign_out', userId);
    req.session.destroy((err) => {
      if (err) return next(err);
      // The same attributes as the cookie had: a browser drops a `__Host-` cookie only for a Secure one.
      res.clearCookie(config.cookieName, { path: '/', httpOnly: true, sameSite: 'lax', secure: config.cookieSecure });
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

  /**
   * An invitation or a reset link: the mailed token and a new password set the password and
   * sign the person in, audited with the way they came.
   */
  const signInWithToken =
    (schema: typeof acceptInviteSchema | typeof resetPasswordSchema, setPassword: typeof acceptInvite, via: string) => async (req: Request, res: Response) => {
      const input = parse(schema, req.body, 'body');
      const user = await setPassword(db, input.token, input.password);
      await startSession(req, user, config);
      await audit(req, 'sign_in', user.id, { via });
      res.json(session(user));
    };

  router.post('/accept-invite', failuresPerAddress, signInWithToken(acceptInviteSchema, acceptInvite, 'invitation'));

  // The same answer, at the same speed, whether or not the account exists: the look-up,
  // the token and the e-mail happen after the answer has gone.
  router.post('/forgot-password', resetsPerAddress, resetsPerAccount, (req, res) => {
    const { email } = parse(forgotPasswordSchema, req.body, 'body');
    const address = req.ip ?? null;
    background.run('password reset', async () => {
      const reset = await requestPasswordReset(db, email, config.publicUrl);
      await writeAudit(db, {
        actorId: null,
        action: 'reset_requested',
        entity: 'account',
        entityId: reset?.user.id ?? null,
        districtId: null,
        before: null,
        after: { email, address, accountFound: Boolean(reset) },
      });
      if (reset) await mailer.send(passwordResetMail(reset.user.email, reset.user.name, reset.url));
    });
    res.status(202).json({ message: 'If that address has an account, a reset link is on its way.' });
  });

  router.post('/reset-password', failuresPerAddress, signInWithToken(resetPasswordSchema, resetPassword, 'password reset'));

  return router;
}
