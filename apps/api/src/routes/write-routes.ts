/** The write routes of a resource people edit with versions, mounted the same way for each. */
import type { Request, Router } from 'express';
import { z } from 'zod';
import { idParamSchema, versionSchema, type NotFoundResource, type ScopedRow, type SubjectName } from '@swardwise/domain';
import type { Db } from '../db/client.ts';
import { ctxAllowed, ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { authorize, type Ctx } from '../services/context.ts';
import { authorizeFieldWrite } from '../services/field-write.ts';
import { writable } from '../services/versioned.ts';

/** `?version=` of a delete: the version of the row the client read. */
export const versionQuerySchema = z.object({ version: z.coerce.number().pipe(versionSchema) });

/**
 * Who may write, checked before the body is read: the role for a creation (its place is in the
 * body, which the service checks again), the role and the row's district, site and crew for a
 * change or a removal (a missing row is 404, a row out of scope 403, as the service answers).
 */
export interface WriteGuard {
  subject: SubjectName;
  resource: NotFoundResource;
  row: (db: Db, id: number) => Promise<ScopedRow | undefined>;
}

export interface WriteOps<C extends z.ZodType, U extends z.ZodType, Q extends z.ZodType = z.ZodType> {
  guard: WriteGuard;
  /** GET `base` answering `{ items }`; the query's schema may depend on the caller (the department's today). */
  list?: { query: Q | ((ctx: Ctx) => Q); run: (ctx: Ctx, query: z.infer<Q>) => Promise<unknown> };
  create?: { body: C; run: (ctx: Ctx, input: z.infer<C>, req: Request) => Promise<unknown> };
  update?: { body: U; run: (ctx: Ctx, id: number, input: z.infer<U>, req: Request) => Promise<unknown> };
  remove?: (ctx: Ctx, id: number, version: number, req: Request) => Promise<void>;
}

/**
 * GET `base` (the list), POST `base` (201), PATCH `base/:id` and DELETE `base/:id?version=` (204): each parses its
 * part of the request with the shared schemas and hands the caller's context to the service.
 * `key` names the answer (`{ crew: … }`); without one the service's answer goes as it is.
 */
export function writeRoutes<C extends z.ZodType, U extends z.ZodType, Q extends z.ZodType>(router: Router, db: Db, base: string, key: string | null, ops: WriteOps<C, U, Q>): void {
  const one = `${base.replace(/\/$/, '')}/:id`;
  const answer = (value: unknown) => (key ? { [key]: value } : value);
  const idOf = (req: Request) => parse(idParamSchema, req.params, 'params').id;
  const { list, create, update, remove, guard } = ops;
  const rowWritable = async (ctx: Ctx, action: 'update' | 'delete', id: number) => writable(ctx, action, guard.subject, guard.resource, id, await guard.row(db, id));
  if (list) {
    router.get(base, async (req, res) => {
      const ctx = ctxOf(db, req);
      const query = list.query instanceof z.ZodType ? list.query : list.query(ctx);
      res.json({ items: await list.run(ctx, parse(query, req.query, 'query')) });
    });
  }
  if (create) {
    router.post(base, async (req, res) => {
      const ctx = ctxOf(db, req);
      authorize(ctx, 'create', guard.subject);
      res.status(201).json(answer(await create.run(ctx, parse(create.body, req.body, 'body'), req)));
    });
  }
  if (update) {
    router.patch(one, async (req, res) => {
      const ctx = ctxOf(db, req);
      const id = idOf(req);
      await rowWritable(ctx, 'update', id);
      res.json(answer(await update.run(ctx, id, parse(update.body, req.body, 'body'), req)));
    });
  }
  if (remove) {
    router.delete(one, async (req, res) => {
      const ctx = ctxOf(db, req);
      const id = idOf(req);
      const { version } = parse(versionQuerySchema, req.query, 'query');
      await rowWritable(ctx, 'delete', id);
      await remove(ctx, id, version, req);
      res.status(204).end();
    });
  }
}

/**
 * GET and PATCH `/:id/<path>` of a one-row setting of a field (its stripe pattern, its line
 * plan), answered as `{ <key>: … }`: read by whoever may read the field; changed by whoever may
 * change the field, checked (the role, then the field's scope) before the body is read.
 */
export function fieldSettingRoutes<B extends z.ZodType>(
  router: Router,
  db: Db,
  path: string,
  key: string,
  ops: { get: (ctx: Ctx, fieldId: number) => Promise<unknown>; body: B; set: (ctx: Ctx, fieldId: number, input: z.infer<B>) => Promise<unknown> },
): void {
  router.get(`/:id/${path}`, async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json({ [key]: await ops.get(ctxOf(db, req), id) });
  });
  router.patch(`/:id/${path}`, async (req, res) => {
    // A crew lead or a partner is refused before anything is read; a foreman of another
    // district once the field's scope is known, still before the body.
    const ctx = ctxAllowed(db, req, 'update', 'Field');
    const { id } = parse(idParamSchema, req.params, 'params');
    await authorizeFieldWrite(ctx, id);
    res.json({ [key]: await ops.set(ctx, id, parse(ops.body, req.body, 'body')) });
  });
}
