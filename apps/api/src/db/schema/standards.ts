/** The department's Standards (one row per maintenance level), field checks and imports. */
import { sql } from 'drizzle-orm';
import { boolean, check, date, index, integer, jsonb, pgTable, real, smallint, text, uniqueIndex } from 'drizzle-orm/pg-core';
import { HARDNESS_DEVICES, type HardnessDevice, type ImportSummary, type LevelStandard, type WearArea } from '@swardwise/domain';
import { fieldRef } from './city.ts';
import { storedPhoto, users } from './people.ts';
import { workOrders } from './work.ts';
import { createdAt, id, instant, updatedAt } from './columns.ts';

export const standards = pgTable('standards', {
  level: smallint('level').primaryKey(),
  data: jsonb('data').$type<LevelStandard>().notNull(),
  version: integer('version').notNull().default(1),
  ...updatedAt,
  updatedBy: integer('updated_by').references(() => users.id),
});

/** An inspection of a field; yields the surface score. */
export const fieldChecks = pgTable(
  'field_checks',
  {
    ...id,
    ...fieldRef,
    checkedOn: date('checked_on', { mode: 'string' }).notNull(),
    checkedBy: integer('checked_by').references(() => users.id),
    turfCoverPct: real('turf_cover_pct').notNull(),
    weedsPct: real('weeds_pct').notNull(),
    barePct: real('bare_pct').notNull(),
    heightMm: real('height_mm'),
    daysSinceCut: integer('days_since_cut'),
    gmax: real('gmax'),
    /** The tester the Gmax reading was taken with: readings of different testers are not comparable. */
    gmaxDevice: text('gmax_device').$type<HardnessDevice>(),
    evenness: smallint('evenness'),
    notes: text('notes').notNull().default(''),
    score: real('score').notNull(),
    flags: jsonb('flags').$type<string[]>().notNull().default([]),
    /** Where the bare or worn turf is (goalmouths, centre, wings, infield). */
    bareAreas: jsonb('bare_areas').$type<WearArea[]>().notNull().default([]),
    /** Each hardness reading (G); `gmax` is their mean, what the score used. */
    hardnessReadings: jsonb('hardness_readings').$type<number[]>().notNull().default([]),
    /** Divots 1 (torn up) to 5 (none). */
    divots: smallint('divots'),
    tornLeafTips: boolean('torn_leaf_tips').notNull().default(false),
    /** The work order the check was logged on, when a crew logged it from Today (its photos are the order's). */
    workOrderId: integer('work_order_id').references(() => workOrders.id, { onDelete: 'set null' }),
    ...createdAt,
  },
  (t) => [
    index('field_checks_field_idx').on(t.fieldId, t.checkedOn),
    // A reading names its tester, and a tester is named only with a reading.
    check('field_checks_gmax_device_check', sql`(${t.gmax} IS NULL) = (${t.gmaxDevice} IS NULL) AND (${t.gmaxDevice} IS NULL OR ${t.gmaxDevice} IN (${sql.raw(HARDNESS_DEVICES.map((d) => `'${d}'`).join(', '))}))`),
  ],
);

/**
 * Photos of a field check logged from the field page (a check logged on a work order keeps its
 * photos with the order). Stored as the crews' photos are: re-encoded, the name made here.
 */
export const fieldCheckPhotos = pgTable(
  'field_check_photos',
  {
    ...id,
    fieldCheckId: integer('field_check_id')
      .notNull()
      .references(() => fieldChecks.id, { onDelete: 'cascade' }),
    ...storedPhoto,
  },
  // A retried upload (same check, same reference, same name) is stored once.
  (t) => [index('field_check_photos_check_idx').on(t.fieldCheckId), uniqueIndex('field_check_photos_file_key').on(t.fieldCheckId, t.fileName)],
);

/**
 * An upload of sites, fields or outlines: previewed first (nothing written), then committed;
 * the last committed import can be undone from what it recorded.
 */
export const imports = pgTable(
  'imports',
  {
    ...id,
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
    ...createdAt,
    committedAt: instant('committed_at'),
    undoneAt: instant('undone_at'),
  },
  (t) => [index('imports_user_idx').on(t.userId, t.createdAt)],
);
