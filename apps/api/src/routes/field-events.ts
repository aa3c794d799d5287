/** Games, tournaments and other bookings of the fields. */
import { Router } from 'express';
import { z } from 'zod';
import { addDaysIso, createFieldEventSchema, idSchema, isoDateSchema as isoDate, updateFieldEventSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import type { Ctx } from '../services/context.ts';
import { createFieldEvent, deleteFieldEvent, eventRows, listFieldEvents, updateFieldEvent } from '../services/field-events.ts';
import { writeRoutes } from './write-routes.ts';

/** Without dates: the coming three months, what a season's bookings list needs at a glance. */
const DEFAULT_DAYS = 92;
const MAX_DAYS = 400;

/** `today` is the department's. */
export const listQuery = (today: string) => z
  .object({
    from: isoDate.optional(),
    to: isoDate.optional(),
    fieldId: idSchema.optional(),
    siteId: idSchema.optional(),
    districtId: idSchema.optional(),
  })
  .transform((q) => {
    const from = q.from ?? (q.to ? addDaysIso(q.to, -DEFAULT_DAYS) : today);
    return { ...q, from, to: q.to ?? addDaysIso(from, DEFAULT_DAYS) };
  })
  .refine((q) => q.from <= q.to, { path: ['to'], message: 'the end date is before the start date' })
  .refine((q) => (Date.parse(q.to) - Date.parse(q.from)) / 86_400_000 <= MAX_DAYS, { path: ['to'], message: `ask for at most ${MAX_DAYS} days at a time` });

export function fieldEventsRouter({ db }: AppDeps): Router {
  const router = Router();

  writeRoutes(router, db, '/', 'event', {
    guard: eventRows,
    list: { query: (ctx: Ctx) => listQuery(ctx.clock.today()), run: listFieldEvents },
    create: { body: createFieldEventSchema, run: createFieldEvent },
    update: { body: updateFieldEventSchema, run: updateFieldEvent },
    remove: deleteFieldEvent,
  });

  return router;
}
