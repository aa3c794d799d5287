/** Crews and equipment of the districts. */
import { Router } from 'express';
import { z } from 'zod';
import { createCrewSchema, createEquipmentSchema, idParamSchema, idSchema, updateCrewSchema, updateEquipmentSchema, versionSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { createCrew, deleteCrew, listCrews, updateCrew } from '../services/crews.ts';
import { createEquipment, deleteEquipment, listEquipment, updateEquipment } from '../services/equipment.ts';

export const districtQuery = z.object({ districtId: idSchema.optional() });
export const versionQuery = z.object({ version: z.coerce.number().pipe(versionSchema) });

export function crewsRouter({ db }: AppDeps): Router {
  const router = Router();

  router.get('/crews', async (req, res) => {
    res.json({ items: await listCrews(ctxOf(db, req), parse(districtQuery, req.query, 'query')) });
  });
  router.post('/crews', async (req, res) => {
    const ctx = ctxOf(db, req);
    res.status(201).json({ crew: await createCrew(ctx, parse(createCrewSchema, req.body, 'body')) });
  });
  router.patch('/crews/:id', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json({ crew: await updateCrew(ctx, id, parse(updateCrewSchema, req.body, 'body')) });
  });
  router.delete('/crews/:id', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    await deleteCrew(ctx, id, parse(versionQuery, req.query, 'query').version);
    res.status(204).end();
  });

  router.get('/equipment', async (req, res) => {
    res.json({ items: await listEquipment(ctxOf(db, req), parse(districtQuery, req.query, 'query')) });
  });
  router.post('/equipment', async (req, res) => {
    const ctx = ctxOf(db, req);
    res.status(201).json({ equipment: await createEquipment(ctx, parse(createEquipmentSchema, req.body, 'body')) });
  });
  router.patch('/equipment/:id', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json({ equipment: await updateEquipment(ctx, id, parse(updateEquipmentSchema, req.body, 'body')) });
  });
  router.delete('/equipment/:id', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    await deleteEquipment(ctx, id, parse(versionQuery, req.query, 'query').version);
    res.status(204).end();
  });

  return router;
}
