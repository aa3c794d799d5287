/** The write routes of a resource people edit with versions, mounted the same way for each. */
import type { Request, Router } from 'express';
import { z } from 'zod';
import { idParamSchema, versionSchema } from '@swardwise/domain';
import type { Db } from '../db/client.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import type { Ctx } from '../services/context.ts';

/** `?version=` of a delete: the version of the row the client read. */
export const versionQuerySchema = z.object({ version: z.coerce.number().pipe(versionSchema) });

export interface WriteOps<C extends z.ZodType, U extends z.ZodType> {
  create?: { body: C; run: (ctx: Ctx, input: z.infer<C>, req: Request) => Promise<unknown> };
  update?: { body: U; run: (ctx: Ctx, id: number, input: z.infer<U>, req: Request) => Promise<unknown> };
  remove?: (ctx: Ctx, id: number, version: number, req: Request) => Promise<void>;
}

/**
 * POST `base` (201), PATCH `base/:id` and DELETE `base/:id?version=` (204): each parses its
 * part of the request with the shared schemas and hands the caller's context to the service.
 * `key` names the answer (`{ crew: … }`); without one the service's answer goes as it is.
 */
export function writeRoutes<C extends z.ZodType, U extends z.ZodType>(router: Router, db: Db, base: string, key: string | null, ops: WriteOps<C, U>): void {
  const one = `${base.replace(/\/$/, '')}/:id`;
  const answer = (value: unknown) => (key ? { [key]: value } : value);
  const idOf = (req: Request) => parse(idParamSchema, req.params, 'params').id;
  const { create, update, remove } = ops;
  if (create) {
    router.post(base, async (req, res) => {
      res.status(201).json(answer(await create.run(ctxOf(db, req), parse(create.body, req.body, 'body'), req)));
    });
  }
  if (update) {
    router.patch(one, async (req, res) => {
      const ctx = ctxOf(db, req);
      const id = idOf(req);
      res.json(answer(await update.run(ctx, id, parse(update.body, req.body, 'body'), req)));
    });
  }
  if (remove) {
    router.delete(one, async (req, res) => {
      const ctx = ctxOf(db, req);
      const id = idOf(req);
      await remove(ctx, id, parse(versionQuerySchema, req.query, 'query').version, req);
      res.status(204).end();
    });
  }
}
