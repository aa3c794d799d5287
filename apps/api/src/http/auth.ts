/** Who is asking: the session's user becomes `req.actor`, checked on every request. */
import type { RequestHandler } from 'express';
import { errors, type Actor } from '@swardwise/domain';
import type { Db } from '../db/client.ts';
import type { Clock } from '../services/clock.ts';
import { contextFor, type Ctx } from '../services/context.ts';
import { actorOf, sessionUser, type SessionEnd, type SessionUser } from '../services/users.ts';

declare module 'express-serve-static-core' {
  interface Request {
    user?: SessionUser;
    actor?: Actor;
    /** The department clock, put on every API request by `withClock`. */
    clock?: Clock;
  }
}

/** Loads the signed-in user (if any); a session of a deactivated account is ended. */
export function loadUser(db: Db): RequestHandler {
  return async (req, _res, next) => {
    const userId = req.session?.userId;
    if (!userId) return next();
    try {
      const user = await sessionUser(db, userId);
      if (!user) {
        // A fresh, empty session rather than none, so this request may still sign in.
        req.session.regenerate((err) => next(err));
        return;
      }
      req.user = user;
      req.actor = actorOf(user);
      next();
    } catch (err) {
      next(err);
    }
  };
}

export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.actor) {
    const ended = endedBecause(req);
    return next(ended ? errors.accessChanged(ended) : errors.unauthenticated());
  }
  next();
};

/** Why an administrator ended this session (role, scope or active changed), if one did. */
const endedBecause = (req: { session?: { endedBecause?: SessionEnd } }) => req.session?.endedBecause;

/** The service context for this request; only after `requireUser`. */
export function ctxOf(db: Db, req: { actor?: Actor; user?: SessionUser; clock?: Clock }): Ctx {
  if (!req.actor || !req.user) throw errors.unauthenticated();
  if (!req.clock) throw new Error('the department clock is not on the request (withClock runs before the routes)');
  return contextFor(db, req.actor, req.user.name, req.clock);
}
