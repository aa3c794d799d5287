import { Router } from 'express';
import { generateWeekSchema, idSchema, rainOutSchema, weekQuerySchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { confirmWeek, generateWeek, getWeekBoard, rainOut } from '../services/week-plans.ts';
import { writeDeps } from './work-orders.ts';

export const confirmSchema = weekQuerySchema.extend({ crewId: idSchema.optional() });

export function weekPlansRouter(deps: AppDeps): Router {
  const { db } = deps;
  const router = Router();
  router.get('/', async (req, res) => {
    res.json(await getWeekBoard(ctxOf(db, req), parse(weekQuerySchema, req.query, 'query')));
  });
  router.post('/generate', async (req, res) => {
    res.json(await generateWeek(ctxOf(db, req), parse(generateWeekSchema, req.body, 'body')));
  });
  router.post('/confirm', async (req, res) => {
    res.json(await confirmWeek(ctxOf(db, req), parse(confirmSchema, req.body, 'body'), writeDeps(deps)));
  });
  router.post('/rain-out', async (req, res) => {
    res.json(await rainOut(ctxOf(db, req), parse(rainOutSchema, req.body, 'body')));
  });
  return router;
}
