/** The commonest route: the caller's context to a service, its answer back as JSON. */
import type { Request, RequestHandler } from 'express';
import type { Action, SubjectName } from '@swardwise/domain';
import type { Db } from '../db/client.ts';
import { ctxAllowed, ctxOf } from '../http/auth.ts';
import type { Ctx } from '../services/context.ts';

/**
 * Answers what `run` gives as JSON (200). With `allowed`, only a caller who may `action` the
 * `subject` at all gets that far (403 otherwise), checked before anything of the request is read.
 */
export function jsonRoute(db: Db, run: (ctx: Ctx, req: Request) => Promise<unknown>, allowed?: [Action, SubjectName]): RequestHandler {
  return async (req, res) => {
    const ctx = allowed ? ctxAllowed(db, req, ...allowed) : ctxOf(db, req);
    res.json(await run(ctx, req));
  };
}

/** `jsonRoute` for a service that writes its answer's JSON text itself (a large answer, kept as text). */
export function jsonTextRoute(db: Db, run: (ctx: Ctx, req: Request) => Promise<string>): RequestHandler {
  return async (req, res) => {
    res.type('application/json').send(await run(ctxOf(db, req), req));
  };
}
