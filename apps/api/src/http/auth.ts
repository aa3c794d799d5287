/** Who is asking: the session's user becomes `req.actor`, checked on every request. */
import type { RequestHandler } from 'express';
import { errors, type Action, type Actor, type SubjectName } from '@swardwise/domain';
import type { Db } from '../db/client.ts';
import type { AuthCache } from './auth-cache.ts';
import type { Clock } from '../services/clock.ts';
import { authorize, contextFor, type Ctx } from '../services/context.ts';
import { actorOf, sessionUser, type SessionEnd, type SessionUser } from '../services/users.ts';

declare module 'express-serve-static-core' {
  interface Request {
    user?: SessionUser;
    actor?: Actor;
    /** The department clock, put on every API request by `withClock`. */
    clock?: Clock;
  }
}

/**
 * Loads the signed-in user (if any); a session of a deactivated account is ended. The user is
 * read through the process's `AuthCache`: a change made elsewhere shows within its bound.
 */
export function loadUser(db: Db, cache: AuthCache): RequestHandler {
  return async (req, _res, next) => {
    const userId = req.session?.userId;
    if (!userId) return next();
    try {
      const user = await cachedSessionUser(db, cache, userId);
      if (!user) {
        // A fresh, empty session rather than none, so this request may still sign in.
        req.session.regenerate((err) => next(err));
        return;
      }
      req.user = user;
      req.actor = actorFor(user);
      next();
    } catch (err) {
      next(err);
    }
  };
}

/** The same actor object while the auth cache keeps the same user, so its ability is built once (services/context.ts). */
const actors = new WeakMap<SessionUser, Actor>();
function actorFor(user: SessionUser): Actor {
  let actor = actors.get(user);
  if (!actor) actors.set(user, (actor = actorOf(user)));
  return actor;
}

async function cachedSessionUser(db: Db, cache: AuthCache, userId: number): Promise<SessionUser | undefined> {
  const cached = cache.user(userId);
  if (cached) return cached.user;
  const since = cache.generation;
  const user = await sessionUser(db, userId);
  cache.putUser(userId, user, since);
  return user;
}

/** After a write request on this process, what it may have changed about accounts and sessions is read again. */
export function forgetAfterWrites(cache: AuthCache): RequestHandler {
  return (req, res, next) => {
    if (req.method !== 'GET' && req.method !== 'HEAD' && req.method !== 'OPTIONS') {
      // Before the answer is sent (the next request may follow at once) and after the write.
      cache.changed();
      res.once('finish', () => cache.changed());
      res.once('close', () => cache.changed());
    }
    next();
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

/**
 * `ctxOf` for a caller who may `action` the `subject` at all (403 otherwise): the route's
 * check of who is asking, before it reads a body or query. Rows are checked by the service.
 */
export function ctxAllowed(db: Db, req: Parameters<typeof ctxOf>[1], action: Action, subject: SubjectName): Ctx {
  const ctx = ctxOf(db, req);
  authorize(ctx, action, subject);
  return ctx;
}
