import { Router } from 'express';
import { z } from 'zod';
import { addDaysIso, createWorkOrderSchema, idSchema, isoDateSchema, updateWorkOrderSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import type { Ctx } from '../services/context.ts';
import { createWorkOrder, deleteWorkOrder, listWorkOrders, updateWorkOrder, storedWorkOrder, type WriteDeps } from '../services/work-orders.ts';
import { writeRoutes } from './write-routes.ts';

/** Without dates: the department's today and the six days after it. */
export const querySchema = (today: string) => z
  .object({
    from: isoDateSchema.optional(),
    to: isoDateSchema.optional(),
    crewId: idSchema.optional(),
    districtId: idSchema.optional(),
  })
  .transform((q) => ({ ...q, from: q.from ?? today, to: q.to ?? addDaysIso(q.from ?? today, 6) }))
  .refine((q) => q.from <= q.to, { path: ['to'], message: 'the end date is before the start date' })
  .refine((q) => (Date.parse(q.to) - Date.parse(q.from)) / 86_400_000 <= 92, { path: ['to'], message: 'ask for at most 92 days at a time' });

/** How the crew lead's e-mail goes out and where the portal lives. */
export function writeDeps({ mailer, config }: AppDeps): WriteDeps {
  return { mailer, publicUrl: config.publicUrl };
}

export function workOrdersRouter(deps: AppDeps): Router {
  const { db } = deps;
  const router = Router();
  writeRoutes(router, db, '/', null, {
    guard: { subject: 'WorkOrder', resource: 'work_order', row: storedWorkOrder },
    list: { query: (ctx: Ctx) => querySchema(ctx.clock.today()), run: listWorkOrders },
    create: { body: createWorkOrderSchema, run: (ctx, input) => createWorkOrder(ctx, input, writeDeps(deps)) },
    update: { body: updateWorkOrderSchema, run: (ctx, id, input) => updateWorkOrder(ctx, id, input, writeDeps(deps)) },
    remove: (ctx, id, version) => deleteWorkOrder(ctx, id, version, writeDeps(deps)),
  });
  return router;
}
