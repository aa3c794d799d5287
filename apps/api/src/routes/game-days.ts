/** Game-day preparation: an event's checklist, its work orders, and the checklist as a PDF. */
import { Router } from 'express';
import { z } from 'zod';
import { addDaysIso, createGameDaySchema, gameDayListSchema, idParamSchema, idSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { gameDayChecklistPdf } from '../services/game-day-pdf.ts';
import { writeDeps } from './work-orders.ts';
import { authorizeGameDay, createGameDayPrep, getGameDay, listGameDays } from '../services/game-days.ts';

/** Without dates: from today, two months of events. */
const DEFAULT_DAYS = 60;
export const eventParamSchema = z.object({ eventId: idSchema });

export function gameDaysRouter(deps: AppDeps): Router {
  const { db } = deps;
  const router = Router();

  router.get('/', async (req, res) => {
    const ctx = ctxOf(db, req);
    const q = parse(gameDayListSchema, req.query, 'query');
    const from = q.from ?? ctx.clock.today();
    const to = q.to ?? addDaysIso(from, DEFAULT_DAYS);
    res.json({ items: await listGameDays(ctx, { from, to, fieldId: q.fieldId, districtId: q.districtId }) });
  });

  router.get('/:id', async (req, res) => {
    const ctx = ctxOf(db, req);
    res.json({ gameDay: await getGameDay(ctx, parse(idParamSchema, req.params, 'params').id) });
  });

  router.get('/:id/checklist.pdf', async (req, res) => {
    const ctx = ctxOf(db, req);
    const prep = await getGameDay(ctx, parse(idParamSchema, req.params, 'params').id);
    const pdf = await gameDayChecklistPdf({ ...prep, createdAt: prep.createdAt.toISOString() }, req.user!.units, ctx.clock.today());
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `attachment; filename="game-day-${prep.eventOn}-${prep.id}.pdf"`);
    res.send(pdf);
  });

  // The booking's scope is checked before the body is read.
  router.post('/events/:eventId', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { eventId } = parse(eventParamSchema, req.params, 'params');
    await authorizeGameDay(ctx, eventId);
    const input = parse(createGameDaySchema, req.body, 'body');
    res.status(201).json(await createGameDayPrep(ctx, eventId, input, writeDeps(deps)));
  });

  return router;
}
