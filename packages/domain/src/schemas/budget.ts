/** The season budget: which season and whose figures, and a line the head sets. */
import { z } from 'zod';
import { BUDGET_LINES } from '../budget.ts';
import { idSchema, versionSchema } from './common.ts';
import { levelStandardChangesSchema } from './standards.ts';

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

/** The Standards a what-if may change per level: the ones that drive the season's work and inputs. */
const scenarioLevelChanges = levelStandardChangesSchema.pick({ minMowingsPerWeek: true, maxMowingIntervalDays: true, annualNShare: true, irrigationShareOfEtc: true, reducedKc: true, lineRepaintDays: true });

/** `POST /api/what-if`: a season, a scope (a district, or the department), fields moved to levels and levels' Standards changed. */
export const whatIfSchema = z
  .object({
    season: seasonSchema,
    districtId: idSchema.optional(),
    moves: z
      .array(z.object({ fieldId: idSchema, level: z.number({ error: 'level must be 1, 2, 3 or 4' }).int('level must be 1, 2, 3 or 4').min(1, 'level must be 1, 2, 3 or 4').max(4, 'level must be 1, 2, 3 or 4') }).strict())
      .max(5000, 'at most 5,000 fields in one scenario')
      .default([]),
    standards: z.partialRecord(z.enum(['1', '2', '3', '4'], { error: 'a level is 1, 2, 3 or 4' }), scenarioLevelChanges).optional(),
  })
  .strict();
export type WhatIfInput = z.infer<typeof whatIfSchema>;

/** `POST /api/what-if/scenarios`: a name and the change (as `POST /api/what-if` takes it); the result is worked out when read. */
export const whatIfScenarioSchema = z
  .object({
    name: z.string({ error: 'give the scenario a name' }).trim().min(1, 'give the scenario a name').max(120, 'a name of at most 120 characters'),
    change: whatIfSchema,
  })
  .strict();
export type WhatIfScenarioInput = z.infer<typeof whatIfScenarioSchema>;

/** `GET /api/what-if/scenarios`: those of a season (none: every season). */
export const whatIfScenarioListSchema = z.object({ season: seasonSchema.optional() }).strict();

/** `GET /api/what-if/scenarios/compare?ids=3,7`: two to four saved scenarios, each worked out against today's outlook. */
export const whatIfCompareSchema = z
  .object({
    ids: z
      .string({ error: 'ids is a list such as 3,7' })
      .max(200, 'ids is a list such as 3,7')
      .transform((s): unknown[] => s.split(',').map((x) => x.trim()))
      .pipe(z.array(idSchema).min(2, 'compare at least 2 scenarios').max(4, 'compare at most 4 scenarios'))
      .refine((ids) => new Set(ids).size === ids.length, 'name each scenario once'),
  })
  .strict();
