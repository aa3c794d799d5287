/** Crews and equipment of the districts. */
import { Router } from 'express';
import { z } from 'zod';
import { createCrewSchema, createEquipmentSchema, idSchema, updateCrewSchema, updateEquipmentSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { createCrew, crewRows, deleteCrew, listCrews, updateCrew } from '../services/crews.ts';
import { createEquipment, deleteEquipment, equipmentRows, listEquipment, updateEquipment } from '../services/equipment.ts';
import { writeRoutes } from './write-routes.ts';

export const districtQuery = z.object({ districtId: idSchema.optional() });

export function crewsRouter({ db }: AppDeps): Router {
  const router = Router();

  writeRoutes(router, db, '/crews', 'crew', {
    guard: crewRows,
    list: { query: districtQuery, run: listCrews },
    create: { body: createCrewSchema, run: createCrew },
    update: { body: updateCrewSchema, run: updateCrew },
    remove: deleteCrew,
  });

  writeRoutes(router, db, '/equipment', 'equipment', {
    guard: equipmentRows,
    list: { query: districtQuery, run: listEquipment },
    create: { body: createEquipmentSchema, run: createEquipment },
    update: { body: updateEquipmentSchema, run: updateEquipment },
    remove: deleteEquipment,
  });

  return router;
}
