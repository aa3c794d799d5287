/** The season budget: the head sets it per line; a foreman reads his district's. CSV and PDF exports. */
import { Router } from 'express';
import { budgetLineSchema, budgetQuerySchema, type BudgetAnswer } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxAllowed, ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { budgetCsv, budgetPdf } from '../services/budget-export.ts';
import { getBudget, setBudgetLine } from '../services/budget.ts';

const fileName = (b: BudgetAnswer, ext: string) => `budget-${b.season}-${b.districtId === null ? 'department' : `district-${b.districtId}`}.${ext}`;

export function budgetRouter({ db }: AppDeps): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    res.json(await getBudget(ctxOf(db, req), parse(budgetQuerySchema, req.query, 'query')));
  });

  router.get('/export.csv', async (req, res) => {
    const b = await getBudget(ctxOf(db, req), parse(budgetQuerySchema, req.query, 'query'));
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${fileName(b, 'csv')}"`);
    res.send(budgetCsv(b));
  });

  router.get('/report.pdf', async (req, res) => {
    const ctx = ctxOf(db, req);
    const b = await getBudget(ctx, parse(budgetQuerySchema, req.query, 'query'));
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `attachment; filename="${fileName(b, 'pdf')}"`);
    res.send(await budgetPdf(b, ctx.clock.today()));
  });

  router.patch('/line', async (req, res) => {
    // Who is asking, before the body is read; the line's district is checked again with the body.
    const ctx = ctxAllowed(db, req, 'update', 'Budget');
    res.json({ line: await setBudgetLine(ctx, parse(budgetLineSchema, req.body, 'body')) });
  });

  return router;
}
