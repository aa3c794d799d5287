/** The season budget the head sets per line, for each district and for the department. */
import { sql } from 'drizzle-orm';
import { index, integer, jsonb, pgTable, real, smallint, text, uniqueIndex } from 'drizzle-orm/pg-core';
import type { BudgetLine, WhatIfInput } from '@swardwise/domain';
import { districts } from './city.ts';
import { createdAt, id, versioned } from './columns.ts';
import { users } from './people.ts';

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

/** A saved what-if: the change (fields moved, Standards changed), never its result, which is worked out against the outlook of the day it is read. */
export const whatIfScenarios = pgTable(
  'what_if_scenarios',
  {
    ...id,
    name: text('name').notNull(),
    season: smallint('season').notNull(),
    /** Null: the department's (every district). */
    districtId: integer('district_id').references(() => districts.id, { onDelete: 'cascade' }),
    change: jsonb('change').$type<WhatIfInput>().notNull(),
    createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
    ...createdAt,
  },
  (t) => [index('what_if_scenarios_district_idx').on(t.districtId), index('what_if_scenarios_season_idx').on(t.season)],
);
