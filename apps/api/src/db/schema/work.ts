/** Equipment, work orders and their photos: the crews' side of the week plan. */
import { sql } from 'drizzle-orm';
import { boolean, check, date, index, integer, jsonb, pgTable, real, smallint, text, uniqueIndex } from 'drizzle-orm/pg-core';
import type { ApplicationRateUnit, ApplicationTask, ApplicationWeather, ClosureReason, ClosureStatus, ClosureWorkChoice, EquipmentKind, FieldEventKind, GameDayStep, PlanLayout, PlanPaint, SeasonShift, StripePattern, WorkStatus, WorkTask } from '@swardwise/domain';
import { districtRef, fieldRef, fields, sites } from './city.ts';
import { createdBy, crews, storedPhoto, users } from './people.ts';
import { createdAt, id, instant, versioned } from './columns.ts';

/** The field a row is about, with copies of its site and district so scope checks need no join. */
const ofField = {
  ...fieldRef,
  siteId: integer('site_id')
    .notNull()
    .references(() => sites.id),
  ...districtRef,
};

export const equipment = pgTable(
  'equipment',
  {
    ...id,
    ...districtRef,
    crewId: integer('crew_id').references(() => crews.id, { onDelete: 'set null' }),
    kind: text('kind').$type<EquipmentKind>().notNull(),
    name: text('name').notNull(),
    /** Mowers: cutting width (m), working speed (km/h), field efficiency (0–1), HOC range (mm). */
    cuttingWidthM: real('cutting_width_m'),
    speedKmh: real('speed_kmh'),
    fieldEfficiency: real('field_efficiency'),
    hocMinMm: real('hoc_min_mm'),
    hocMaxMm: real('hoc_max_mm'),
    /** Hour meter and blade care. */
    hourMeterH: real('hour_meter_h').notNull().default(0),
    sharpenIntervalH: real('sharpen_interval_h'),
    lastSharpenedAtH: real('last_sharpened_at_h'),
    notes: text('notes').notNull().default(''),
    active: boolean('active').notNull().default(true),
    ...versioned,
  },
  (t) => [index('equipment_district_idx').on(t.districtId)],
);

/**
 * Work on a field carries the field with copies of its site and district; a yard job
 * (sharpening a mower's blades) has no field and no site, only its district, crew and the
 * equipment it concerns (a check constraint keeps field and site together).
 */
export const workOrders = pgTable(
  'work_orders',
  {
    ...id,
    fieldId: integer('field_id').references(() => fields.id, { onDelete: 'cascade' }),
    siteId: integer('site_id').references(() => sites.id),
    ...districtRef,
    task: text('task').$type<WorkTask>().notNull(),
    weekStart: date('week_start', { mode: 'string' }).notNull(),
    plannedDate: date('planned_date', { mode: 'string' }).notNull(),
    crewId: integer('crew_id').references(() => crews.id, { onDelete: 'set null' }),
    equipmentId: integer('equipment_id').references(() => equipment.id, { onDelete: 'set null' }),
    plannedHours: real('planned_hours').notNull(),
    actualHours: real('actual_hours'),
    status: text('status').$type<WorkStatus>().notNull().default('planned'),
    origin: text('origin').$type<'generated' | 'manual'>().notNull(),
    /** Set when a person assigned, moved or logged it: re-generating the week keeps it. */
    pinned: boolean('pinned').notNull().default(false),
    /** Why the plan asks for it, in words (e.g. the one-third rule's date). */
    reason: text('reason').notNull().default(''),
    details: jsonb('details').$type<Record<string, unknown>>().notNull().default({}),
    notes: text('notes').notNull().default(''),
    startedAt: instant('started_at'),
    doneAt: instant('done_at'),
    doneBy: integer('done_by').references(() => users.id),
    ...createdBy,
    ...versioned,
  },
  (t) => [
    index('work_orders_week_idx').on(t.districtId, t.weekStart),
    index('work_orders_crew_idx').on(t.crewId, t.plannedDate),
    index('work_orders_field_idx').on(t.fieldId, t.plannedDate),
    // The overview's inputs (feed, water, paint) of a season read only those tasks.
    index('work_orders_task_date_idx').on(t.task, t.plannedDate),
    check('work_orders_place_check', sql`(${t.fieldId} is null) = (${t.siteId} is null)`),
  ],
);

/** A row about one work order, gone with the order. */
const workOrderRef = {
  workOrderId: integer('work_order_id')
    .notNull()
    .references(() => workOrders.id, { onDelete: 'cascade' }),
};

export const workPhotos = pgTable(
  'work_photos',
  {
    ...id,
    ...workOrderRef,
    ...storedPhoto,
  },
  // One row per file: a retried upload (same order, same phone reference, same name) is stored once.
  (t) => [index('work_photos_order_idx').on(t.workOrderId), uniqueIndex('work_photos_file_key').on(t.workOrderId, t.fileName)],
);

/**
 * What a crew reported on a work order, one row per submission. `clientRef` is made by the
 * phone before the first try, so a submission retried after a lost answer is stored once.
 */
export const workUpdates = pgTable(
  'work_updates',
  {
    ...id,
    ...workOrderRef,
    status: text('status').$type<WorkStatus>().notNull(),
    actualHours: real('actual_hours'),
    note: text('note').notNull().default(''),
    clientRef: text('client_ref'),
    /** When the crew did it (the phone's clock), which may be before it reached the server. */
    reportedAt: instant('reported_at').notNull(),
    ...createdBy,
    ...createdAt,
  },
  (t) => [index('work_updates_order_idx').on(t.workOrderId), uniqueIndex('work_updates_client_ref_key').on(t.clientRef)],
);

/** Games, tournaments and other bookings of a field: the lines are painted before them. */
export const fieldEvents = pgTable(
  'field_events',
  {
    ...id,
    ...ofField,
    kind: text('kind').$type<FieldEventKind>().notNull(),
    title: text('title').notNull(),
    startsOn: date('starts_on', { mode: 'string' }).notNull(),
    startTime: text('start_time'),
    notes: text('notes').notNull().default(''),
    ...createdBy,
    ...versioned,
  },
  (t) => [index('field_events_field_idx').on(t.fieldId, t.startsOn), index('field_events_district_idx').on(t.districtId, t.startsOn)],
);

/**
 * Every decision about a field's status (closed, restricted, reopened), kept as history. The
 * one in force has no `to_at`; `fields.status` is kept in step with it in the same transaction,
 * so code that reads the field's status needs no join. Scope comes from the field's site.
 */
export const fieldClosures = pgTable(
  'field_closures',
  {
    ...id,
    ...fieldRef,
    status: text('status').$type<ClosureStatus>().notNull(),
    /** Null for a reopening. */
    reason: text('reason').$type<ClosureReason>(),
    /** Internal: never on the public status board. */
    note: text('note').notNull().default(''),
    fromAt: instant('from_at').notNull(),
    toAt: instant('to_at'),
    expectedReopenOn: date('expected_reopen_on', { mode: 'string' }),
    decidedBy: integer('decided_by').references(() => users.id),
    workChoice: text('work_choice').$type<ClosureWorkChoice>(),
    workCount: smallint('work_count').notNull().default(0),
    ...createdAt,
  },
  (t) => [
    index('field_closures_field_idx').on(t.fieldId, t.fromAt),
    // One decision in force per field: the status board joins on it.
    uniqueIndex('field_closures_current_key').on(t.fieldId).where(sql`${t.toAt} is null`),
  ],
);

/**
 * What was put on a field (fertiliser, seed, topdressing, a pesticide): product, rate as the
 * label states it, area, date, who applied it (and the licence for a pesticide), and the
 * station's weather that day. A record outlives its work order: pesticide records are kept.
 */
export const applications = pgTable(
  'applications',
  {
    ...id,
    ...ofField,
    workOrderId: integer('work_order_id').references(() => workOrders.id, { onDelete: 'set null' }),
    task: text('task').$type<ApplicationTask>().notNull(),
    product: text('product').notNull(),
    rate: real('rate').notNull(),
    rateUnit: text('rate_unit').$type<ApplicationRateUnit>().notNull(),
    areaM2: real('area_m2').notNull(),
    appliedOn: date('applied_on', { mode: 'string' }).notNull(),
    applicator: text('applicator').notNull(),
    licenceNumber: text('licence_number'),
    weather: jsonb('weather').$type<ApplicationWeather | null>(),
    notes: text('notes').notNull().default(''),
    ...createdBy,
    ...createdAt,
  },
  (t) => [index('applications_field_idx').on(t.fieldId, t.appliedOn), index('applications_district_idx').on(t.districtId, t.appliedOn)],
);

/**
 * The stripe pattern a foreman asks for on a field's mowings, and the mower its pass plan is
 * worked out for (null: the mower the week plan picks). One row per field; no row, no pattern.
 * Scope comes from the field's site.
 */
export const fieldStripes = pgTable(
  'field_stripes',
  {
    ...id,
    ...fieldRef,
    pattern: text('pattern').$type<StripePattern>().notNull(),
    mowerId: integer('mower_id').references(() => equipment.id, { onDelete: 'set null' }),
    setBy: integer('set_by').references(() => users.id),
    ...versioned,
  },
  (t) => [uniqueIndex('field_stripes_field_key').on(t.fieldId)],
);

/**
 * A field's line plan: its layouts (template, size, colour, place on the field), the paint
 * choices and marker, the season window (MM-DD) and the seasonal shift of each season (key:
 * the year). One row per field; no row, no plan. Scope comes from the field's site.
 */
export const fieldLinePlans = pgTable(
  'field_line_plans',
  {
    ...id,
    ...fieldRef,
    layouts: jsonb('layouts').$type<PlanLayout[]>().notNull(),
    paint: jsonb('paint').$type<PlanPaint>().notNull(),
    markerId: integer('marker_id').references(() => equipment.id, { onDelete: 'set null' }),
    seasonStart: text('season_start').notNull(),
    seasonEnd: text('season_end').notNull(),
    shifts: jsonb('shifts').$type<Record<string, SeasonShift>>().notNull(),
    setBy: integer('set_by').references(() => users.id),
    ...versioned,
  },
  (t) => [uniqueIndex('field_line_plans_field_key').on(t.fieldId)],
);

/**
 * A logo placed on a field for painting: the stored picture (a cleaned SVG or a PNG, and a
 * PNG rendering of it the portal and the set-out sheet show), where it sits in the field frame
 * (m), how it is turned and scaled, the grid the crew strings out, and the colours it was
 * reduced to with each one's share of the picture. Scope comes from the field's site.
 */
export const fieldLogos = pgTable(
  'field_logos',
  {
    ...id,
    ...fieldRef,
    name: text('name').notNull(),
    /** The cleaned upload inside the uploads folder (never a client-supplied name). */
    fileName: text('file_name').notNull(),
    /** The PNG rendering inside the uploads folder. */
    renderName: text('render_name').notNull(),
    mime: text('mime').notNull(),
    pixelWidth: integer('pixel_width').notNull(),
    pixelHeight: integer('pixel_height').notNull(),
    centerXM: real('center_x_m').notNull(),
    centerYM: real('center_y_m').notNull(),
    widthM: real('width_m').notNull(),
    rotationDeg: real('rotation_deg').notNull().default(0),
    gridSpacingM: real('grid_spacing_m').notNull().default(1),
    colours: jsonb('colours').$type<Array<{ hex: string; share: number }>>().notNull(),
    backgroundHex: text('background_hex'),
    ...createdBy,
    ...versioned,
  },
  (t) => [index('field_logos_field_idx').on(t.fieldId)],
);

/**
 * A game-day preparation: the checklist that readies a field for one booking (a partner's game
 * request becomes a booking too). Each step names the work order it became; its progress is
 * those orders' statuses. Scope copies come from the field, as on every work row.
 */
export const gameDayPreps = pgTable(
  'game_day_preps',
  {
    ...id,
    ...ofField,
    eventId: integer('event_id')
      .notNull()
      .references(() => fieldEvents.id, { onDelete: 'cascade' }),
    steps: jsonb('steps').$type<{ step: GameDayStep; workOrderId: number | null }[]>().notNull(),
    /** The colourant chosen (product, label rate mL/m², area m²); null: none. */
    colourant: jsonb('colourant').$type<{ product: string; rateMlPerM2: number; areaM2: number } | null>(),
    /** The mowing pattern chosen for the event; null: plain mowing. */
    pattern: text('pattern').$type<StripePattern>(),
    ...createdBy,
    ...versioned,
  },
  (t) => [uniqueIndex('game_day_preps_event_key').on(t.eventId), index('game_day_preps_district_idx').on(t.districtId)],
);
