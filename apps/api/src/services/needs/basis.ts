/**
 * What every needs card is worked out from: the field, its level's Standards, the department
 * parameters, and the weather of the nearest station for the week asked for (or the latest
 * week with weather), run through the engine's daily series once.
 */
import { asc, eq } from 'drizzle-orm';
import { appError, addDaysIso, DAY_MONTH_YEAR, formatDay, fieldDailySeries, grassSeason, mondayOf, type Level, type NeedInput } from '@swardwise/domain';
import { sites, weatherDays } from '../../db/schema/index.ts';
import type { Ctx } from '../context.ts';
import { getField } from '../fields.ts';
import { loadParameters, loadStandards } from '../standards.ts';
import { nearestStation, prepareStationWeather, stationsWithWeather, unbrokenRunAround, type StationWithWeather, type WeatherRow } from '../stations.ts';

export const input = (key: string, label: string, value: NeedInput['value'], unit: string | null = null): NeedInput => ({ key, label, value, unit });

export const sum = (xs: ArrayLike<number>) => {
  let total = 0;
  for (let i = 0; i < xs.length; i++) total += xs[i] as number;
  return total;
};
export const r = (v: number, digits = 3) => Math.round(v * 10 ** digits) / 10 ** digits;

/** The week the figures are for, and the unbroken run of weather days around it. */
interface NeedsWeek {
  weekStart: string;
  weekEnd: string;
  weatherNote: string | null;
  run: WeatherRow[];
}

const dayText = (iso: string) => formatDay(iso, DAY_MONTH_YEAR);

/** The week asked for, or else the latest week with weather on or before it. */
function chooseWeek(station: StationWithWeather, allDays: WeatherRow[], requested: string): NeedsWeek {
  const askedStart = mondayOf(requested);
  const askedEnd = addDaysIso(askedStart, 6);
  const have = new Set(allDays.map((d) => d.date));
  let weekStart = askedStart;
  let weekEnd = askedEnd;
  let weatherNote: string | null = null;
  const covered = Array.from({ length: 7 }, (_, i) => addDaysIso(askedStart, i)).filter((d) => have.has(d)).length;
  if (covered < 7) {
    const before = allDays.filter((d) => d.date <= askedEnd);
    const last = (before.length ? before[before.length - 1]! : allDays[allDays.length - 1]!).date;
    weekEnd = last;
    weekStart = addDaysIso(last, -6);
    weatherNote = `${station.name} has ${covered ? `only ${covered} of 7 days of` : 'no'} weather for the week of ${dayText(askedStart)} to ${dayText(askedEnd)}. These figures use the latest week with weather instead: ${dayText(weekStart)} to ${dayText(weekEnd)}.`;
  }

  // The unbroken run of days around the week: the season the chart and the mowing simulation use.
  const run = unbrokenRunAround(allDays, allDays.findIndex((d) => d.date === weekEnd));
  if (run[0]!.date > weekStart) {
    weekStart = run[0]!.date;
    weatherNote ??= `The weather on file starts on ${dayText(weekStart)}; the week is shortened to the days with weather.`;
  }
  return { weekStart, weekEnd, weatherNote, run };
}

/** Loads the field (authorising the read), its Standards, the parameters and its weather, and runs the daily series. */
export async function loadNeedsBasis(ctx: Ctx, fieldId: number, date?: string) {
  const field = await getField(ctx, fieldId); // authorizes 'read' on this field's district and site
  const [site] = await ctx.db.select({ lat: sites.lat, lng: sites.lng, kind: sites.kind }).from(sites).where(eq(sites.id, field.siteId));
  const level = field.maintenanceLevel as Level;
  const { standards, versions, missing } = await loadStandards(ctx.db);
  const params = await loadParameters(ctx.db);
  const std = standards[level];

  const here = { lat: site!.lat, lng: site!.lng };
  const station = nearestStation(await stationsWithWeather(ctx.db), here);
  if (!station) throw appError('weather/none', 'No weather station has daily weather on file, so the needs of this field cannot be worked out yet. Add weather first.');
  const allDays = await ctx.db.select().from(weatherDays).where(eq(weatherDays.stationId, station.id)).orderBy(asc(weatherDays.date));

  const requested = date ?? ctx.clock.today();
  const { weekStart, weekEnd, weatherNote, run } = chooseWeek(station, allDays, requested);
  const prepared = prepareStationWeather(station, run);
  const w0 = prepared.dates.indexOf(weekStart);
  const w1 = prepared.dates.indexOf(weekEnd);
  const weekDays = w1 - w0 + 1;
  const inWeek = <T>(xs: ArrayLike<T>) => Array.prototype.slice.call(xs, w0, w1 + 1) as T[];

  const outlookField = { id: field.id, areaM2: field.areaM2, sport: field.sport, grass: field.grass, maintenanceLevel: level, hocOverrideMm: field.hocOverrideMm, clippings: field.clippings, irrigation: field.irrigation };
  const daily = fieldDailySeries(outlookField, prepared, standards, params);
  const season = grassSeason(field.grass);
  return { field, site: site!, level, standards, versions, missing, params, std, station, requested, weekStart, weekEnd, weatherNote, lastWeatherDate: allDays.at(-1)?.date ?? null, run, prepared, w0, w1, weekDays, inWeek, outlookField, daily, season };
}

export type NeedsBasis = Awaited<ReturnType<typeof loadNeedsBasis>>;
