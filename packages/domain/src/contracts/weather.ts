/** Weather stations and their daily weather. */
import type { WeatherDayInput } from '../schemas/weather.ts';
import type { Instant } from './common.ts';
import type { WeatherGap } from '../engine/dates.ts';

/** A row of `GET /api/weather/stations`, with what it has on file. */
export interface WeatherStationRow {
  id: number;
  code: string;
  name: string;
  lat: number;
  lng: number;
  elevationM: number;
  dayCount: number;
  forecastDays: number;
  /** First and last day on file; null for a station without weather. */
  firstDate: string | null;
  lastDate: string | null;
  /** Days up to today with no weather after the last day on file (the service down, a file not uploaded). */
  gap: WeatherGap | null;
}

/** `GET /api/weather/stations`; `service` says whether a hosted weather service is configured. */
export interface StationsAnswer {
  items: WeatherStationRow[];
  service: boolean;
}

/** One day of weather at a station (SI units). */
export interface WeatherDayRow<At extends Instant = string> {
  stationId: number;
  date: string;
  kind: 'observed' | 'forecast';
  tmaxC: number;
  tminC: number;
  rhMaxPct: number | null;
  rhMinPct: number | null;
  windMs: number | null;
  sunshineH: number | null;
  solarMJ: number | null;
  rainMm: number;
  /** Where the day came from: `csv`, `service` or `seed`. */
  source: string;
  updatedAt: At;
}

/** `GET /api/weather/stations/:id/days`: the days on file in the range and the dates without weather. */
export interface WeatherDaysAnswer<At extends Instant = string> {
  days: WeatherDayRow<At>[];
  gaps: string[];
}

/** One line of a station file as checked. */
export interface StationCsvRow {
  line: number;
  data: WeatherDayInput | null;
  errors: { column: string; message: string }[];
}

/** `POST /api/weather/stations/:id/csv`: the check of a file, and whether it was saved. */
export interface StationCsvAnswer {
  committed: boolean;
  rows: StationCsvRow[];
  summary: { rows: number; valid: number; invalid: number };
}

/** `POST /api/weather/stations/:id/pull`: days saved and the dates the service had nothing for. */
export interface PullAnswer {
  saved: number;
  missing: string[];
}

/** Details of a weather error answer beyond field issues: the bad rows of a file, the unusable days of a pull. */
export interface WeatherErrorDetails {
  rows?: StationCsvRow[];
  rejected?: { date: string | null; message: string }[];
}
