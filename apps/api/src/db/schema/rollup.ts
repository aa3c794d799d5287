/**
 * Summary tables the overview and the sites compare read instead of every work order. They are
 * kept exact by database triggers (migration `rollup_triggers`): every insert, update and delete
 * of a work order adds its contribution with a sign, a field's area change re-weighs its orders.
 * Sums are `numeric` so adding and taking away a row leaves no rounding residue.
 */
import { sql } from 'drizzle-orm';
import { bigint, boolean, check, date, integer, numeric, pgTable, primaryKey, real, smallint, text } from 'drizzle-orm/pg-core';

const total = (name: string) => numeric(name).notNull().default('0');
const count = (name: string) => integer(name).notNull().default(0);

/** Per district and planned day (the department's local date): the overview's labour, mowings and inputs. */
export const rollupOverviewDay = pgTable(
  'rollup_overview_day',
  {
    districtId: integer('district_id').notNull(),
    day: date('day', { mode: 'string' }).notNull(),
    orders: count('orders'),
    plannedHours: total('planned_hours'),
    ordersDone: count('orders_done'),
    actualHoursDone: total('actual_hours_done'),
    plannedHoursDone: total('planned_hours_done'),
    mowAsked: count('mow_asked'),
    mowDone: count('mow_done'),
    /** Done after the one-third rule's due date, in `rollup_state.time_zone`. */
    mowLate: count('mow_late'),
    /** Not done: missed once the day has passed (today is the reader's). */
    mowNotDone: count('mow_not_done'),
    /** Orders on a field only: N of done feeds, kg. */
    nKgDone: total('n_kg_done'),
    /** Irrigation not skipped / done: a controller's volume (L) and a quick coupler's run minutes × field area (min·m², times the precipitation rate when read). */
    waterVolBudget: total('water_vol_budget'),
    waterQcBudget: total('water_qc_budget'),
    waterVolUsed: total('water_vol_used'),
    waterQcUsed: total('water_qc_used'),
    paintPlanned: total('paint_planned'),
    paintUsed: total('paint_used'),
  },
  (t) => [primaryKey({ columns: [t.districtId, t.day] })],
);

/**
 * Done work orders on a field, summed from January up to the end of `month` of `year` (the
 * year to date: any run of whole months is one or two rows apart), per district, site and
 * crew (0: none): the compare's orders, hours and inputs.
 */
export const rollupCompareCrewYtd = pgTable(
  'rollup_compare_crew_ytd',
  {
    year: smallint('year').notNull(),
    month: smallint('month').notNull(),
    districtId: integer('district_id').notNull(),
    siteId: integer('site_id').notNull(),
    crewKey: integer('crew_key').notNull(),
    orders: count('orders'),
    hours: total('hours'),
    kgN: total('kg_n'),
    waterM3: total('water_m3'),
    paintL: total('paint_l'),
    colourantL: total('colourant_l'),
  },
  (t) => [primaryKey({ columns: [t.year, t.month, t.districtId, t.siteId, t.crewKey] })],
);

/**
 * The same year to date, hours per site, equipment (0: none), task and mower kind: the
 * machine kind is worked out when read, so an equipment's kind or a task's usual machine may
 * change freely.
 */
export const rollupCompareMachineYtd = pgTable(
  'rollup_compare_machine_ytd',
  {
    year: smallint('year').notNull(),
    month: smallint('month').notNull(),
    districtId: integer('district_id').notNull(),
    siteId: integer('site_id').notNull(),
    equipmentKey: integer('equipment_key').notNull(),
    task: text('task').notNull(),
    reel: boolean('reel').notNull(),
    hours: total('hours'),
  },
  (t) => [primaryKey({ columns: [t.year, t.month, t.districtId, t.siteId, t.equipmentKey, t.task, t.reel] })],
);

/**
 * A counter per year, month and site, raised by triggers on the two tables above whenever a
 * row of theirs for that site and month is added, changed or removed (migration
 * `compare_site_versions`). Counters only ever go up, so the sum over the months a compare
 * reads changes exactly when one of its rows did: the compare then reads again only the sites
 * whose sum moved. No row: never changed (0).
 */
export const rollupCompareSiteVersions = pgTable(
  'rollup_compare_site_versions',
  {
    year: smallint('year').notNull(),
    month: smallint('month').notNull(),
    siteId: integer('site_id').notNull(),
    version: bigint('version', { mode: 'number' }).notNull().default(0),
  },
  (t) => [primaryKey({ columns: [t.year, t.month, t.siteId] })],
);

/** The time zone the late mowings of `rollup_overview_day` were counted in (one row). */
export const rollupState = pgTable(
  'rollup_state',
  {
    id: integer('id').primaryKey().default(1),
    timeZone: text('time_zone').notNull(),
  },
  (t) => [check('rollup_state_one_row', sql`${t.id} = 1`)],
);

/**
 * Each field's latest field check (by date, then by id), as the fields list and the map show
 * it: kept by a trigger on field_checks, read by the overview and the compare.
 */
export const rollupFieldLatest = pgTable('rollup_field_latest', {
  fieldId: integer('field_id').primaryKey(),
  checkId: integer('check_id').notNull(),
  checkedOn: date('checked_on', { mode: 'string' }).notNull(),
  score: real('score').notNull(),
});
