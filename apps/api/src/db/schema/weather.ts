/** Weather stations and their daily observations and forecasts. */
import { date, doublePrecision, index, integer, pgTable, primaryKey, real, text, uniqueIndex } from 'drizzle-orm/pg-core';
import { id, updatedAt, versioned } from './columns.ts';

export const weatherStations = pgTable(
  'weather_stations',
  {
    ...id,
    code: text('code').notNull(),
    name: text('name').notNull(),
    lat: doublePrecision('lat').notNull(),
    lng: doublePrecision('lng').notNull(),
    elevationM: real('elevation_m').notNull(),
    /** Coastal stations use kRs 0.19 when radiation comes from the temperature range (FAO-56 eq. 50). */
    coastal: integer('coastal').notNull().default(0),
    ...versioned,
  },
  (t) => [uniqueIndex('weather_stations_code_key').on(t.code)],
);

/** One day at one station; a forecast row is replaced by the observation when it arrives. */
export const weatherDays = pgTable(
  'weather_days',
  {
    stationId: integer('station_id')
      .notNull()
      .references(() => weatherStations.id, { onDelete: 'cascade' }),
    date: date('date', { mode: 'string' }).notNull(),
    kind: text('kind').$type<'observed' | 'forecast'>().notNull(),
    tmaxC: real('tmax_c').notNull(),
    tminC: real('tmin_c').notNull(),
    rhMaxPct: real('rh_max_pct'),
    rhMinPct: real('rh_min_pct'),
    /** Wind speed at 2 m, m/s. */
    windMs: real('wind_ms'),
    sunshineH: real('sunshine_h'),
    solarMJ: real('solar_mj'),
    rainMm: real('rain_mm').notNull().default(0),
    source: text('source').notNull(),
    ...updatedAt,
  },
  (t) => [primaryKey({ columns: [t.stationId, t.date] }), index('weather_days_date_idx').on(t.date)],
);
