/** Weather stations and their days: station files, the hosted service, and gaps. */
import Papa from 'papaparse';
import { and, asc, eq, gte, lte, sql } from 'drizzle-orm';
import {
  appError,
  errors,
  addDaysIso,
  weatherDaySchema,
  weatherGapUntil,
  type DailyWeather,
  type PullAnswer,
  type StationCsvAnswer,
  type StationCsvRow,
  type WeatherDayInput,
  type WeatherDaysAnswer,
  type WeatherStationRow,
} from '@swardwise/domain';
import type { Db } from '../db/client.ts';
import { weatherDays, weatherStations } from '../db/schema/index.ts';
import { fetchWeather, type WeatherClientSettings } from '../weather/client.ts';
import { writeAudit } from './audit.ts';
import { authorize, type Ctx } from './context.ts';

/** A stored day as the turf engine takes it: missing humidity, wind and sunshine stay absent. */
export function dailyWeatherOf(r: typeof weatherDays.$inferSelect): DailyWeather {
  const d: DailyWeather = { date: r.date, tmaxC: r.tmaxC, tminC: r.tminC, rainMm: r.rainMm };
  if (r.rhMaxPct !== null) d.rhMaxPct = r.rhMaxPct;
  if (r.rhMinPct !== null) d.rhMinPct = r.rhMinPct;
  if (r.windMs !== null) d.windMs = r.windMs;
  if (r.sunshineH !== null) d.sunshineH = r.sunshineH;
  if (r.solarMJ !== null) d.solarMJ = r.solarMJ;
  return d;
}

export async function listStations(ctx: Ctx): Promise<WeatherStationRow[]> {
  authorize(ctx, 'read', 'Weather');
  const counts = ctx.db
    .select({
      stationId: weatherDays.stationId,
      dayCount: sql<number>`count(*)::int`.as('day_count'),
      firstDate: sql<string>`min(${weatherDays.date})::text`.as('first_date'),
      lastDate: sql<string>`max(${weatherDays.date})::text`.as('last_date'),
      forecastDays: sql<number>`count(*) filter (where ${weatherDays.kind} = 'forecast')::int`.as('forecast_days'),
    })
    .from(weatherDays)
    .groupBy(weatherDays.stationId)
    .as('c');
  const rows = await ctx.db
    .select({
      id: weatherStations.id,
      code: weatherStations.code,
      name: weatherStations.name,
      lat: weatherStations.lat,
      lng: weatherStations.lng,
      elevationM: weatherStations.elevationM,
      dayCount: sql<number>`coalesce(${counts.dayCount}, 0)`,
      forecastDays: sql<number>`coalesce(${counts.forecastDays}, 0)`,
      firstDate: counts.firstDate,
      lastDate: counts.lastDate,
    })
    .from(weatherStations)
    .leftJoin(counts, eq(counts.stationId, weatherStations.id))
    .orderBy(asc(weatherStations.code));
  const today = ctx.clock.today();
  return rows.map((row) => ({ ...row, gap: weatherGapUntil(row.lastDate, today) }));
}

async function station(ctx: Ctx, id: number) {
  const [row] = await ctx.db.select().from(weatherStations).where(eq(weatherStations.id, id));
  if (!row) throw errors.notFound('weather_station', id);
  return row;
}

/** Days in a range, with the dates that have no weather listed as gaps. */
export async function listDays(ctx: Ctx, stationId: number, from: string, to: string): Promise<WeatherDaysAnswer<Date>> {
  authorize(ctx, 'read', 'Weather');
  await station(ctx, stationId);
  const days = await ctx.db
    .select()
    .from(weatherDays)
    .where(and(eq(weatherDays.stationId, stationId), gte(weatherDays.date, from), lte(weatherDays.date, to)))
    .orderBy(asc(weatherDays.date));
  const have = new Set(days.map((d) => d.date));
  const gaps: string[] = [];
  for (let d = from; d <= to; d = addDaysIso(d, 1)) if (!have.has(d)) gaps.push(d);
  return { days, gaps };
}

/** The columns of a station file, in our own names (SI units). */
const STATION_CSV_COLUMNS = ['date', 'tmax_c', 'tmin_c', 'rh_max_pct', 'rh_min_pct', 'wind_ms', 'sunshine_h', 'solar_mj', 'rain_mm'] as const;

type CsvRow = StationCsvRow;

const COLUMN_OF: Record<string, string> = {
  tmaxC: 'tmax_c',
  tminC: 'tmin_c',
  rhMaxPct: 'rh_max_pct',
  rhMinPct: 'rh_min_pct',
  windMs: 'wind_ms',
  sunshineH: 'sunshine_h',
  solarMJ: 'solar_mj',
  rainMm: 'rain_mm',
  date: 'date',
};

const num = (v: string | undefined) => (v === undefined || v.trim() === '' ? null : Number(v.trim()));

/** Parses and checks a station file row by row; nothing is written. */
function parseStationCsv(text: string): { rows: CsvRow[]; summary: { rows: number; valid: number; invalid: number } } {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: 'greedy', transformHeader: (h) => h.trim().toLowerCase() });
  const headers = parsed.meta.fields ?? [];
  const missing = ['date', 'tmax_c', 'tmin_c'].filter((c) => !headers.includes(c));
  if (missing.length) {
    throw appError('weather/csv_columns', `The file needs the columns ${missing.join(', ')} (expected: ${STATION_CSV_COLUMNS.join(', ')})`);
  }
  const seen = new Set<string>();
  const rows: CsvRow[] = parsed.data.map((raw, i) => {
    const line = i + 2; // the header is line 1
    const candidate = {
      date: raw.date?.trim(),
      tmaxC: num(raw.tmax_c),
      tminC: num(raw.tmin_c),
      rhMaxPct: num(raw.rh_max_pct),
      rhMinPct: num(raw.rh_min_pct),
      windMs: num(raw.wind_ms),
      sunshineH: num(raw.sunshine_h),
      solarMJ: num(raw.solar_mj),
      rainMm: num(raw.rain_mm) ?? 0,
    };
    const errors: CsvRow['errors'] = [];
    for (const [key, value] of Object.entries(candidate)) {
      if (typeof value === 'number' && Number.isNaN(value)) errors.push({ column: COLUMN_OF[key] ?? key, message: 'not a number' });
    }
    const result = errors.length ? null : weatherDaySchema.safeParse(candidate);
    if (result && !result.success) {
      for (const issue of result.error.issues) errors.push({ column: COLUMN_OF[String(issue.path[0])] ?? String(issue.path[0]), message: issue.message });
    }
    const data = result?.success ? result.data : null;
    if (data && seen.has(data.date)) errors.push({ column: 'date', message: `${data.date} appears twice in the file` });
    if (data) seen.add(data.date);
    return { line, data: errors.length ? null : data, errors };
  });
  const invalid = rows.filter((r) => r.errors.length).length;
  return { rows, summary: { rows: rows.length, valid: rows.length - invalid, invalid } };
}

async function saveDays(ctx: Ctx, stationId: number, days: WeatherDayInput[], source: string) {
  await (ctx.db as Db).transaction(async (tx) => {
    for (let i = 0; i < days.length; i += 500) {
      const chunk = days.slice(i, i + 500).map((d) => ({ stationId, ...d, source, updatedAt: new Date() }));
      await tx
        .insert(weatherDays)
        .values(chunk)
        .onConflictDoUpdate({
          target: [weatherDays.stationId, weatherDays.date],
          set: {
            kind: sql`excluded.kind`,
            tmaxC: sql`excluded.tmax_c`,
            tminC: sql`excluded.tmin_c`,
            rhMaxPct: sql`excluded.rh_max_pct`,
            rhMinPct: sql`excluded.rh_min_pct`,
            windMs: sql`excluded.wind_ms`,
            sunshineH: sql`excluded.sunshine_h`,
            solarMJ: sql`excluded.solar_mj`,
            rainMm: sql`excluded.rain_mm`,
            source: sql`excluded.source`,
            updatedAt: sql`excluded.updated_at`,
          },
        });
    }
    await writeAudit(tx, {
      actorId: ctx.actor.id,
      action: 'update',
      entity: 'weather',
      entityId: stationId,
      districtId: null,
      before: null,
      after: { source, days: days.length, from: days[0]?.date ?? null, to: days.at(-1)?.date ?? null },
    });
  });
}

/** Checks a station file and, when asked and clean, writes all of it or nothing. */
export async function uploadStationCsv(ctx: Ctx, stationId: number, text: string, commit: boolean): Promise<StationCsvAnswer> {
  authorize(ctx, 'create', 'Weather');
  await station(ctx, stationId);
  const preview = parseStationCsv(text);
  if (!commit) return { committed: false, ...preview };
  if (preview.summary.invalid > 0) {
    throw appError('weather/csv_has_errors', `${preview.summary.invalid} row(s) have errors; fix them and upload again — nothing was saved`, {
      rows: preview.rows.filter((r) => r.errors.length),
    });
  }
  await saveDays(
    ctx,
    stationId,
    preview.rows.map((r) => r.data!),
    'csv',
  );
  return { committed: true, ...preview };
}

/** Pulls a range from the hosted service into a station. A malformed answer writes nothing; gaps are reported. */
export async function pullFromService(ctx: Ctx, stationId: number, from: string, to: string, settings: WeatherClientSettings | null): Promise<PullAnswer> {
  authorize(ctx, 'create', 'Weather');
  const st = await station(ctx, stationId);
  const fetched = await fetchWeather(settings, { lat: st.lat, lng: st.lng }, from, to);
  if (fetched.rejected.length) {
    throw appError('weather/malformed_rows', `The weather service sent ${fetched.rejected.length} unusable day(s); nothing was saved`, {
      rejected: fetched.rejected,
    });
  }
  if (fetched.days.length) await saveDays(ctx, stationId, fetched.days, 'service');
  return { saved: fetched.days.length, missing: fetched.missing };
}
