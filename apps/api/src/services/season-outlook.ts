/**
 * The season outlook of many fields at once (a district's or the department's), as the budget
 * and the what-if read it: each field with the weather of its nearest station over the
 * season's days on file, the Standards and the department parameters, ready for the engine.
 */
import { and, asc, eq, gte, inArray, lte } from 'drizzle-orm';
import { fieldOutlook, type DepartmentParameters, type FieldOutlook, type Level, type OutlookField, type PreparedWeather, type Standards } from '@swardwise/domain';
import type { Queryable } from '../db/client.ts';
import { fields, sites, weatherDays } from '../db/schema/index.ts';
import { cachedAnswer } from './answer-cache.ts';
import type { Ctx } from './context.ts';
import { loadParameters, loadStandards } from './standards.ts';
import { nearestStation, prepareStationWeather, stationsWithWeather, unbrokenRunAround } from './stations.ts';

export interface SeasonFieldInput {
  field: OutlookField & { id: number; districtId: number };
  weather: PreparedWeather;
}

export interface SeasonBasis {
  inputs: SeasonFieldInput[];
  standards: Standards;
  params: DepartmentParameters;
  /** First and last day of the weather used (over every station); null when the season has none. */
  from: string | null;
  to: string | null;
  /** Fields left out because no station has weather in the season. */
  withoutWeather: number;
}

/** The fields of a district (or all, `districtId` undefined; or those named) with their season's weather. */
export async function loadSeasonBasis(db: Queryable, season: number, scope: { districtId?: number; fieldIds?: number[] }): Promise<SeasonBasis> {
  const conditions = [];
  if (scope.districtId !== undefined) conditions.push(eq(sites.districtId, scope.districtId));
  if (scope.fieldIds) conditions.push(inArray(fields.id, scope.fieldIds.length ? scope.fieldIds : [-1]));
  const rows = await db
    .select({ id: fields.id, districtId: sites.districtId, lat: sites.lat, lng: sites.lng, areaM2: fields.areaM2, sport: fields.sport, grass: fields.grass, maintenanceLevel: fields.maintenanceLevel, hocOverrideMm: fields.hocOverrideMm, clippings: fields.clippings, irrigation: fields.irrigation })
    .from(fields)
    .innerJoin(sites, eq(sites.id, fields.siteId))
    .where(and(...conditions))
    .orderBy(asc(fields.id));
  const { standards } = await loadStandards(db);
  const params = await loadParameters(db);
  const stations = await stationsWithWeather(db);
  const prepared = new Map<number, PreparedWeather | null>();
  const seasonFrom = `${season}-01-01`;
  const seasonTo = `${season}-12-31`;
  const weatherOf = async (stationId: number) => {
    if (prepared.has(stationId)) return prepared.get(stationId)!;
    const station = stations.find((s) => s.id === stationId)!;
    const days = await db.select().from(weatherDays).where(and(eq(weatherDays.stationId, stationId), gte(weatherDays.date, seasonFrom), lte(weatherDays.date, seasonTo))).orderBy(asc(weatherDays.date));
    // The latest unbroken run of the season's days: the engine needs consecutive days.
    const w = days.length ? prepareStationWeather(station, unbrokenRunAround(days, days.length - 1)) : null;
    prepared.set(stationId, w);
    return w;
  };
  const inputs: SeasonFieldInput[] = [];
  let withoutWeather = 0;
  let from: string | null = null;
  let to: string | null = null;
  for (const r of rows) {
    const station = nearestStation(stations, { lat: r.lat, lng: r.lng });
    const weather = station ? await weatherOf(station.id) : null;
    if (!weather) {
      withoutWeather++;
      continue;
    }
    const first = weather.startDate;
    const last = weather.dates[weather.dates.length - 1]!;
    if (from === null || first < from) from = first;
    if (to === null || last > to) to = last;
    const { lat: _lat, lng: _lng, ...f } = r;
    inputs.push({ field: { ...f, maintenanceLevel: f.maintenanceLevel as Level }, weather });
  }
  return { inputs, standards, params, from, to, withoutWeather };
}

/** Every field's outlook over its season weather. */
export function seasonOutlooks(basis: Pick<SeasonBasis, 'inputs' | 'standards' | 'params'>): FieldOutlook[] {
  return basis.inputs.map((i) => fieldOutlook(i.field, i.weather, basis.standards, basis.params));
}

/** What a season basis is read from: a work order logged or a scenario saved leaves it as it was. */
const SEASON_BASIS_TABLES = ['fields', 'sites', 'standards', 'settings', 'weather_stations', 'weather_days'] as const;

/**
 * A scope's season basis and every field's outlook, kept until a table they read is written
 * (fields, sites, weather, stations, Standards, settings: the change counters of
 * `answer-cache.ts`), not when work is logged or a scenario saved. A what-if works out only the fields its change touches on top of these:
 * on a 3,000-field department, loading and working out the rest took most of its second.
 */
export function cachedSeasonOutlooks(ctx: Ctx, season: number, districtId: number | null): Promise<{ basis: SeasonBasis; outlooks: FieldOutlook[] }> {
  return cachedAnswer(
    ctx,
    'season-outlooks',
    JSON.stringify([season, districtId]),
    async () => {
      const basis = await loadSeasonBasis(ctx.db, season, districtId === null ? {} : { districtId });
      return { basis, outlooks: seasonOutlooks(basis) };
    },
    { tables: SEASON_BASIS_TABLES },
  );
}
