/** The season budget: which season and whose figures, and a line the head sets. */
import { z } from 'zod';
import { BUDGET_LINES } from '../budget.ts';
import { idSchema, versionSchema } from './common.ts';

/** A season is a calendar year of the department's dates. */
export const seasonSchema = z.coerce.number({ error: 'the season is a year such as 2026' }).int('the season is a year such as 2026').min(2000, 'the season is a year from 2000').max(2100, 'the season is a year up to 2100');

/** `GET /api/budget`: a season, and a district (none: the department). */
export const budgetQuerySchema = z
  .object({
    season: seasonSchema,
    districtId: idSchema.optional(),
  })
  .strict();
export type BudgetQuery = z.infer<typeof budgetQuerySchema>;

/** `PATCH /api/budget/line`: one line's budget (null clears it); `version` is the line's, or absent for a line never set. */
export const budgetLineSchema = z
  .object({
    season: seasonSchema,
    districtId: idSchema.nullable(),
    line: z.enum(BUDGET_LINES, { error: `the line is one of ${BUDGET_LINES.join(', ')}` }),
    amount: z.number({ error: 'the budget is a number' }).finite('the budget is a number').min(0, 'the budget cannot be negative').max(1_000_000_000, 'the budget is at most 1,000,000,000').nullable(),
    version: versionSchema.optional(),
  })
  .strict();
export type BudgetLineInput = z.infer<typeof budgetLineSchema>;
