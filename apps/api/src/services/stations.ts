/**
 * Which weather a field is worked out with: the nearest station (great-circle distance) that
 * has daily weather, and the unbroken run of days around the day asked for. Needs, week
 * plans and the map all choose the same way.
 */
import { and, asc, eq, lte, sql } from 'drizzle-orm';
import { greatCircleKm, isoToDayNumber, prepareWeather, type PreparedWeather } from '@swardwise/domain';
import type { Queryable } from '../db/client.ts';
import { weatherDays, weatherStations } from '../db/schema/index.ts';
import { dailyWeatherOf } from './weather.ts';

export type WeatherRow = typeof weatherDays.$inferSelect;

/** The stations that have at least one day of weather, by id. */
export async function stationsWithWeather(db: Queryable) {
  return db
    .select({ id: weatherStations.id, code: weatherStations.code, name: weatherStations.name, lat: weatherStations.lat, lng: weatherStations.lng, elevationM: weatherStations.elevationM, coastal: weatherStations.coastal })
    .from(weatherStations)
    .where(sql`exists (select 1 from ${weatherDays} where ${weatherDays.stationId} = ${weatherStations.id})`)
    .orderBy(asc(weatherStations.id));
}

export type StationWithWeather = Awaited<ReturnType<typeof stationsWithWeather>>[number];

/** The station nearest to a point with its distance (km); the first listed wins a tie; undefined when there is none. */
export function nearestStation<S extends { lat: number; lng: number }>(stations: readonly S[], here: { lat: number; lng: number }): (S & { distanceKm: number }) | undefined {
  let best: S | undefined;
  let bestKm = Infinity;
  for (const s of stations) {
    const km = greatCircleKm(here, { lat: s.lat, lng: s.lng });
    if (km < bestKm) [best, bestKm] = [s, km];
  }
  return best ? { ...best, distanceKm: bestKm } : undefined;
}

/** The days (sorted by date) that follow one another without a gap, around `rows[index]`. */
export function unbrokenRunAround<T extends { date: string }>(rows: readonly T[], index: number): T[] {
  const day = (i: number) => isoToDayNumber(rows[i]!.date);
  let start = index;
  while (start > 0 && day(start - 1) === day(start) - 1) start--;
  let end = index;
  while (end < rows.length - 1 && day(end + 1) === day(end) + 1) end++;
  return rows.slice(Math.max(0, start), end + 1);
}

/** A station's weather, prepared for the engine (FAO-56 needs its latitude, elevation and coast). */
export function prepareStationWeather(station: Pick<StationWithWeather, 'lat' | 'elevationM' | 'coastal'>, rows: readonly WeatherRow[]): PreparedWeather {
  return prepareWeather(rows.map(dailyWeatherOf), { latDeg: station.lat, elevationM: station.elevationM, coastal: station.coastal === 1 });
}

/**
 * Weather for planning up to `until`: per station the latest unbroken run of days on or
 * before it (observations and forecasts), prepared once and shared by the station's fields.
 */
export async function planningWeather(db: Queryable, until: string) {
  const stations = await stationsWithWeather(db);
  const prepared = new Map<number, PreparedWeather>();
  const load = async (stationId: number) => {
    const cached = prepared.get(stationId);
    if (cached) return cached;
    const station = stations.find((x) => x.id === stationId)!;
    const rows = await db.select().from(weatherDays).where(and(eq(weatherDays.stationId, stationId), lte(weatherDays.date, until))).orderBy(asc(weatherDays.date));
    const w = prepareStationWeather(station, unbrokenRunAround(rows, rows.length - 1));
    prepared.set(stationId, w);
    return w;
  };
  return { stations, load, nearest: (here: { lat: number; lng: number }) => nearestStation(stations, here) };
}
