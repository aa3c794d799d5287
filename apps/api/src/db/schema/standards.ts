/** The department's Standards (one row per maintenance level), field checks and imports. */
import { date, index, integer, jsonb, pgTable, real, smallint, text, timestamp } from 'drizzle-orm/pg-core';
import type { ImportSummary, LevelStandard } from '@swardwise/domain';
import { fields } from './city.ts';
import { users } from './people.ts';

export const standards = pgTable('standards', {
  level: smallint('level').primaryKey(),
  data: jsonb('data').$type<LevelStandard>().notNull(),
  version: integer('version').notNull().default(1),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  updatedBy: integer('updated_by').references(() => users.id),
});

/** An inspection of a field; yields the surface score. */
export const fieldChecks = pgTable(
  'field_checks',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    fieldId: integer('field_id')
      .notNull()
      .references(() => fields.id, { onDelete: 'cascade' }),
    checkedOn: date('checked_on', { mode: 'string' }).notNull(),
    checkedBy: integer('checked_by').references(() => users.id),
    turfCoverPct: real('turf_cover_pct').notNull(),
    weedsPct: real('weeds_pct').notNull(),
    barePct: real('bare_pct').notNull(),
    heightMm: real('height_mm'),
    daysSinceCut: integer('days_since_cut'),
    gmax: real('gmax'),
    evenness: smallint('evenness'),
    notes: text('notes').notNull().default(''),
    score: real('score').notNull(),
    flags: jsonb('flags').$type<string[]>().notNull().default([]),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('field_checks_field_idx').on(t.fieldId, t.checkedOn)],
);

/**
 * An upload of sites, fields or outlines: previewed first (nothing written), then committed;
 * the last committed import can be undone from what it recorded.
 */
export const imports = pgTable(
  'imports',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    kind: text('kind').$type<'sites_csv' | 'fields_csv' | 'outlines_geojson'>().notNull(),
    status: text('status').$type<'preview' | 'committed' | 'undone' | 'discarded'>().notNull().default('preview'),
    userId: integer('user_id')
      .notNull()
      .references(() => users.id),
    /** District the import is limited to (a foreman's), null for department-wide. */
    districtId: integer('district_id'),
    fileName: text('file_name').notNull(),
    /** Parsed rows with their errors, as shown in the preview. */
    rows: jsonb('rows').$type<unknown[]>().notNull(),
    summary: jsonb('summary').$type<ImportSummary>().notNull(),
    /** What the commit did, so it can be undone: ids created and rows as they were before an update. */
    changes: jsonb('changes').$type<{ created: { entity: string; id: number }[]; updated: { entity: string; id: number; before: Record<string, unknown> }[] }>(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    committedAt: timestamp('committed_at', { withTimezone: true }),
    undoneAt: timestamp('undone_at', { withTimezone: true }),
  },
  (t) => [index('imports_user_idx').on(t.userId, t.createdAt)],
);
