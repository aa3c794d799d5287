/** The season budget the head sets per line, for each district and for the department. */
import { sql } from 'drizzle-orm';
import { index, integer, pgTable, real, smallint, text, uniqueIndex } from 'drizzle-orm/pg-core';
import type { BudgetLine } from '@swardwise/domain';
import { districts } from './city.ts';
import { id, versioned } from './columns.ts';

export const budgetLines = pgTable(
  'budget_lines',
  {
    ...id,
    season: smallint('season').notNull(),
    /** Null: the department's own line (all districts). */
    districtId: integer('district_id').references(() => districts.id),
    line: text('line').$type<BudgetLine>().notNull(),
    /** In the department's currency, or hours for equipment. */
    amount: real('amount').notNull(),
    ...versioned,
  },
  // One row per season, scope and line; the department's scope (null) keys as 0.
  (t) => [uniqueIndex('budget_lines_key').on(t.season, sql`coalesce(${t.districtId}, 0)`, t.line), index('budget_lines_district_idx').on(t.districtId)],
);
