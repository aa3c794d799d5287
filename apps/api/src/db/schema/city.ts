/** Districts, sites and fields: the places the department keeps, which change together. */
import { sql } from 'drizzle-orm';
import { check, date, doublePrecision, index, integer, jsonb, pgTable, real, smallint, text, uniqueIndex } from 'drizzle-orm/pg-core';
import type { Clippings, FieldStatus, Grass, IrrigationKind, Level, Polygon, Rootzone, SiteKind, SiteOwner, Sport } from '@swardwise/domain';
import { id, versioned } from './columns.ts';

export const districts = pgTable(
  'districts',
  {
    ...id,
    code: text('code').notNull(),
    name: text('name').notNull(),
    boundary: jsonb('boundary').$type<Polygon>().notNull(),
    yardName: text('yard_name').notNull(),
    yardLat: doublePrecision('yard_lat').notNull(),
    yardLng: doublePrecision('yard_lng').notNull(),
    ...versioned,
  },
  (t) => [uniqueIndex('districts_code_key').on(t.code)],
);

/** A row of one district (its scope). */
export const districtRef = {
  districtId: integer('district_id')
    .notNull()
    .references(() => districts.id),
};

export const sites = pgTable(
  'sites',
  {
    ...id,
    ...districtRef,
    name: text('name').notNull(),
    kind: text('kind').$type<SiteKind>().notNull(),
    owner: text('owner').$type<SiteOwner>().notNull(),
    address: text('address').notNull().default(''),
    lat: doublePrecision('lat').notNull(),
    lng: doublePrecision('lng').notNull(),
    notes: text('notes').notNull().default(''),
    ...versioned,
  },
  (t) => [index('sites_district_idx').on(t.districtId)],
);

export const fields = pgTable(
  'fields',
  {
    ...id,
    siteId: integer('site_id')
      .notNull()
      .references(() => sites.id),
    name: text('name').notNull(),
    sport: text('sport').$type<Sport>().notNull(),
    grass: text('grass').$type<Grass>().notNull(),
    rootzone: text('rootzone').$type<Rootzone>().notNull(),
    irrigation: text('irrigation').$type<IrrigationKind>().notNull(),
    maintenanceLevel: smallint('maintenance_level').$type<Level>().notNull(),
    hocOverrideMm: real('hoc_override_mm'),
    clippings: text('clippings').$type<Clippings>().notNull(),
    status: text('status').$type<FieldStatus>().notNull().default('open'),
    statusNote: text('status_note').notNull().default(''),
    weeklyUseHours: real('weekly_use_hours').notNull().default(0),
    geometry: jsonb('geometry').$type<Polygon>().notNull(),
    /** Geodesic area of `geometry`, kept in step with it by the service on every write. */
    areaM2: doublePrecision('area_m2').notNull(),
    /** Bearing of the long axis, 0–180° from north, kept in step with `geometry`. */
    longAxisDeg: real('long_axis_deg'),
    /** Date of the last mowing done (from work records). */
    lastMowedOn: date('last_mowed_on', { mode: 'string' }),
    ...versioned,
  },
  (t) => [
    index('fields_site_idx').on(t.siteId),
    check('fields_level_check', sql`${t.maintenanceLevel} BETWEEN 1 AND 4`),
  ],
);

/** A row about one field, gone with the field. */
export const fieldRef = {
  fieldId: integer('field_id')
    .notNull()
    .references(() => fields.id, { onDelete: 'cascade' }),
};
