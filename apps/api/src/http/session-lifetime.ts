/**
 * Two limits on a session: idle (no request for SESSION_IDLE_DAYS) and absolute
 * (SESSION_MAX_DAYS after sign-in, however busy). express-session's rolling cookie keeps
 * only the first; the sign-in time is kept in the session itself for the second, and the
 * cookie and the stored row are never given a life past it.
 */
import type { Request, RequestHandler } from 'express';
import type { Config } from '../config.ts';

declare module 'express-session' {
  interface SessionData {
    /** When the user signed in (ms since the epoch). */
    signedInAt: number;
  }
}

type Limits = Pick<Config, 'sessionIdleMs' | 'sessionMaxMs'>;

/** Sets the cookie (and so the stored row) to end at the nearer of the two limits. */
export function capSessionExpiry(req: Request, limits: Limits, now = Date.now()): void {
  const signedInAt = req.session.signedInAt ?? now;
  req.session.cookie.expires = new Date(Math.min(now + limits.sessionIdleMs, signedInAt + limits.sessionMaxMs));
}

/** Ends a signed-in session past its absolute limit (or without a sign-in time) before anything reads it. */
export function sessionLifetime(limits: Limits): RequestHandler {
  return (req, _res, next) => {
    if (!req.session?.userId) return next();
    const now = Date.now();
    const signedInAt = req.session.signedInAt;
    if (typeof signedInAt !== 'number' || now - signedInAt >= limits.sessionMaxMs) {
      // A fresh, empty session: the old one is gone from the store and the caller is signed out.
      req.session.regenerate((err) => next(err));
      return;
    }
    capSessionExpiry(req, limits, now);
    next();
  };
}
