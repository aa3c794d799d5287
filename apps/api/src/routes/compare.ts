/** Sites compared by cost, hours and inputs per acre and surface score: as JSON and as a CSV file. */
import { Router } from 'express';
import Papa from 'papaparse';
import { compareQuerySchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxAllowed } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { COMPARE_CSV_COLUMNS, compareSites } from '../services/compare.ts';
import { jsonRoute } from './json-routes.ts';

export function compareRouter({ db }: AppDeps): Router {
  const router = Router();

  router.get('/sites', jsonRoute(db, (ctx, req) => compareSites(ctx, parse(compareQuerySchema, req.query, 'query')), ['read', 'SiteComparison']));

  router.get('/sites.csv', async (req, res) => {
    const ctx = ctxAllowed(db, req, 'read', 'SiteComparison');
    const answer = await compareSites(ctx, parse(compareQuerySchema, req.query, 'query'));
    const csv = Papa.unparse({
      fields: COMPARE_CSV_COLUMNS.map(([h]) => h),
      data: answer.rows.map((r) => COMPARE_CSV_COLUMNS.map(([, v]) => v(r) ?? '')),
    }, { escapeFormulae: true });
    res
      .type('text/csv; charset=utf-8')
      .setHeader('Content-Disposition', `attachment; filename="sites-${answer.period.from}-to-${answer.period.to}.csv"`)
      .send(csv);
  });

  return router;
}
