/** What-if previews of a season (nothing is saved), and the saved scenarios (the change, not its result). */
import { Router } from 'express';
import { idParamSchema, whatIfCompareSchema, whatIfScenarioListSchema, whatIfScenarioSchema, whatIfSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxAllowed } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { compareScenarios, createScenario, deleteScenario, listScenarios, previewWhatIf } from '../services/what-if.ts';
import { jsonRoute } from './json-routes.ts';

export function whatIfRouter({ db }: AppDeps): Router {
  const router = Router();

  // Who is asking, before the body is read; the scenario's district and fields are checked with it.
  router.post('/', jsonRoute(db, (ctx, req) => previewWhatIf(ctx, parse(whatIfSchema, req.body, 'body')), ['read', 'Budget']));
  router.get('/scenarios', jsonRoute(db, (ctx, req) => listScenarios(ctx, parse(whatIfScenarioListSchema, req.query, 'query')), ['read', 'WhatIfScenario']));
  router.get('/scenarios/compare', jsonRoute(db, (ctx, req) => compareScenarios(ctx, parse(whatIfCompareSchema, req.query, 'query').ids), ['read', 'WhatIfScenario']));

  router.post('/scenarios', async (req, res) => {
    // Roles that save no what-if are refused before the body is read; the district in it is checked again.
    const ctx = ctxAllowed(db, req, 'create', 'WhatIfScenario');
    res.status(201).json({ scenario: await createScenario(ctx, parse(whatIfScenarioSchema, req.body, 'body')) });
  });

  router.delete('/scenarios/:id', async (req, res) => {
    const ctx = ctxAllowed(db, req, 'read', 'WhatIfScenario');
    await deleteScenario(ctx, parse(idParamSchema, req.params, 'params').id);
    res.status(204).end();
  });

  return router;
}
