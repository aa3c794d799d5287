/** Crews and equipment of the districts. */
import { Router } from 'express';
import { z } from 'zod';
import { createCrewSchema, createEquipmentSchema, idSchema, updateCrewSchema, updateEquipmentSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { createCrew, crewRow, deleteCrew, listCrews, updateCrew } from '../services/crews.ts';
import { createEquipment, deleteEquipment, getRow as equipmentRow, listEquipment, updateEquipment } from '../services/equipment.ts';
import { writeRoutes } from './write-routes.ts';

export const districtQuery = z.object({ districtId: idSchema.optional() });

export function crewsRouter({ db }: AppDeps): Router {
  const router = Router();

  router.get('/crews', async (req, res) => {
    res.json({ items: await listCrews(ctxOf(db, req), parse(districtQuery, req.query, 'query')) });
  });
  writeRoutes(router, db, '/crews', 'crew', {
    guard: { subject: 'Crew', resource: 'crew', row: crewRow },
    create: { body: createCrewSchema, run: createCrew },
    update: { body: updateCrewSchema, run: updateCrew },
    remove: deleteCrew,
  });

  router.get('/equipment', async (req, res) => {
    res.json({ items: await listEquipment(ctxOf(db, req), parse(districtQuery, req.query, 'query')) });
  });
  writeRoutes(router, db, '/equipment', 'equipment', {
    guard: { subject: 'Equipment', resource: 'equipment', row: equipmentRow },
    create: { body: createEquipmentSchema, run: createEquipment },
    update: { body: updateEquipmentSchema, run: updateEquipment },
    remove: deleteEquipment,
  });

  return router;
}
