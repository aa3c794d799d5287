/**
 * The map: everything the caller may see in one compact answer, with the values of every
 * map theme. Overdue mowing is grown by the turf engine from the last mowing over the
 * nearest station's weather (one-third rule: overdue above 1.5 × HOC).
 *
 * PGlite runs one query at a time, so the answer is built from a handful of queries and
 * computed in memory; it is cached per (caller's scope, day, data fingerprint), and the
 * fingerprint changes with any write to the tables it reads.
 */
import { and, asc, desc, eq, inArray, sql, type SQL } from 'drizzle-orm';
import { cachedAnswer } from './answer-cache.ts';
import {
  DAY_MONTH_YEAR,
  formatDay,
  DEFAULT_PARAMETERS,
  DEFAULT_STANDARDS,
  GRASSES,
  LEVELS,
  dailyGrowthMm,
  districtScope,
  grassSeason,
  hocFor,
  isoToDayNumber,
  dayNumberToIso,
  fieldCheckDue,
  mowTriggerHeightMm,
  mowingDue,
  type Due,
  type MowingDue,
  type Grass,
  type BasemapAnswer,
  type Level,
  type LevelStandard,
  type MapAnswer,
  type MapDistrict,
  type MapField,
  type MapQuery,
  type MapSite,
  type Polygon,
  type Standards,
} from '@swardwise/domain';
import { districts, fieldChecks, fields, settings, sites, standards, weatherDays, weatherStations } from '../db/schema/index.ts';
import { authorize, can, type Ctx } from './context.ts';
import { fieldCrewIds, fieldScope, siteScope } from './scope.ts';
import { nearestStation } from './stations.ts';

export type { BasemapAnswer, MapAnswer, MapDistrict, MapField, MapSite };

const round6 = (v: number) => Math.round(v * 1e6) / 1e6;
const round1 = (v: number) => Math.round(v * 10) / 10;

/** Positions to 6 decimals (about 0.1 m): a third of the bytes of full precision. */
function compact(polygon: Polygon): Polygon {
  return { type: 'Polygon', coordinates: polygon.coordinates.map((ring) => ring.map((p) => [round6(p[0]), round6(p[1])])) as Polygon['coordinates'] };
}

async function cached(ctx: Ctx, query: MapQuery) {
  authorize(ctx, 'read', 'Field');
  const requested = query.asOf ?? ctx.clock.today();
  // Kept as JSON too: serialising 3,000 outlines costs more than the lookup.
  return cachedAnswer(ctx, 'map', requested, async () => {
    const answer = await buildMap(ctx, requested);
    return { answer, json: JSON.stringify(answer) };
  });
}

/** Everything on the map the caller may see (see `MapAnswer`). */
export async function mapData(ctx: Ctx, query: MapQuery): Promise<MapAnswer> {
  return (await cached(ctx, query)).answer;
}

/** The same answer, already serialised for the response. */
export async function mapDataJson(ctx: Ctx, query: MapQuery): Promise<string> {
  return (await cached(ctx, query)).json;
}

interface StationSeries {
  id: number;
  lat: number;
  lng: number;
  latest: string | null;
}

async function buildMap(ctx: Ctx, requested: string): Promise<MapAnswer> {
  const rows = await loadMapRows(ctx);
  const visibleSites = rows.sites.filter((s) => can(ctx, 'read', 'Site', s));
  const visibleFields = rows.fields.filter((f) => can(ctx, 'read', 'Field', f));
  const standardsTable = standardsFrom(rows.standards);
  const withWeather = rows.stations.filter((s) => s.latest !== null);
  const day = mapDay(withWeather, requested);
  let weatherNote = day.weatherNote;

  // Nearest station (great-circle distance) with weather, per site.
  const stationOfSite = new Map<number, number>();
  for (const s of rows.sites) {
    const best = nearestStation(withWeather, s);
    if (best) stationOfSite.set(s.id, best.id);
  }
  const growth = await growthForFields(ctx.db, visibleFields, stationOfSite, day.asOf);
  let gapDays = 0;
  const out: MapField[] = visibleFields.map((f) => {
    const hocMm = hocFor({ sport: f.sport, grass: f.grass as Grass, maintenanceLevel: f.maintenanceLevel as Level, hocOverrideMm: f.hocOverrideMm }, standardsTable);
    const days = f.lastMowedOn ? isoToDayNumber(day.asOf) - isoToDayNumber(f.lastMowedOn) : null;
    const stationId = stationOfSite.get(f.siteId);
    const height = days !== null && day.latestWeather !== null && stationId !== undefined ? heightSinceMowing(f, days, hocMm, growth?.get(stationId), day.asOf) : NO_HEIGHT;
    gapDays = Math.max(gapDays, height.daysWithoutWeather);
    const std = standardsTable[f.maintenanceLevel as Level];
    const mowGrowth = f.lastMowedOn && stationId !== undefined ? growthAfter(growth?.get(stationId), f.grass as Grass, f.lastMowedOn, day.asOf) : [];
    const due = { check: fieldCheckDue(f.scoredOn, std.fieldCheckDays, requested), mow: mowingDue(f.lastMowedOn, hocMm, std, mowGrowth, requested) };
    return toMapField(f, hocMm, days, height, due);
  });
  if (gapDays > 0) {
    const gap = `Some fields were last mowed before the first day with weather: up to ${gapDays} days without weather add no growth, so their heights are low estimates.`;
    weatherNote = weatherNote ? `${weatherNote} ${gap}` : gap;
  }

  return {
    asOf: day.asOf,
    requested,
    weatherNote,
    districts: rows.districts.filter((d) => can(ctx, 'read', 'District', d)).map((d) => ({ ...d, boundary: compact(d.boundary) })),
    sites: visibleSites,
    fields: out,
  };
}

/** The rows the map is built from, in scope for the caller; PGlite takes them one query at a time. */
async function loadMapRows(ctx: Ctx) {
  const { db } = ctx;
  const dScope = districtScope(ctx.actor);
  const districtCond: SQL | undefined = dScope === 'all' ? undefined : dScope.length ? inArray(districts.id, dScope) : sql`false`;

  const latest = db.$with('latest').as(
    db
      .selectDistinctOn([fieldChecks.fieldId], { fieldId: fieldChecks.fieldId, score: fieldChecks.score, checkedOn: fieldChecks.checkedOn })
      .from(fieldChecks)
      .orderBy(fieldChecks.fieldId, desc(fieldChecks.checkedOn), desc(fieldChecks.id)),
  );

  const districtRows = await db.select({ id: districts.id, name: districts.name, boundary: districts.boundary }).from(districts).where(districtCond).orderBy(asc(districts.name));
  const siteRows = await db
    .select({ id: sites.id, name: sites.name, kind: sites.kind, districtId: sites.districtId, lat: sites.lat, lng: sites.lng })
    .from(sites)
    .where(siteScope(ctx.actor))
    .orderBy(asc(sites.name));
  const fieldRows = await db
    .with(latest)
    .select({
      id: fields.id,
      siteId: fields.siteId,
      districtId: sites.districtId,
      name: fields.name,
      sport: fields.sport,
      grass: fields.grass,
      maintenanceLevel: fields.maintenanceLevel,
      hocOverrideMm: fields.hocOverrideMm,
      status: fields.status,
      areaM2: fields.areaM2,
      longAxisDeg: fields.longAxisDeg,
      lastMowedOn: fields.lastMowedOn,
      crewIds: fieldCrewIds,
      version: fields.version,
      geometry: fields.geometry,
      score: latest.score,
      scoredOn: latest.checkedOn,
    })
    .from(fields)
    .innerJoin(sites, eq(sites.id, fields.siteId))
    .leftJoin(latest, eq(latest.fieldId, fields.id))
    .where(fieldScope(ctx.actor))
    .orderBy(asc(fields.id));
  const standardRows = await db.select({ level: standards.level, data: standards.data }).from(standards);
  const stationRows: StationSeries[] = await db
    .select({ id: weatherStations.id, lat: weatherStations.lat, lng: weatherStations.lng, latest: sql<string | null>`max(${weatherDays.date})` })
    .from(weatherStations)
    .leftJoin(weatherDays, eq(weatherDays.stationId, weatherStations.id))
    .groupBy(weatherStations.id)
    .orderBy(asc(weatherStations.id));
  return { districts: districtRows, sites: siteRows, fields: fieldRows, standards: standardRows, stations: stationRows };
}

type MapFieldRow = Awaited<ReturnType<typeof loadMapRows>>['fields'][number];

/** The day the map describes: the day asked for, or the latest day with weather before it (said in the note). */
const dayText = (iso: string) => formatDay(iso, DAY_MONTH_YEAR);

function mapDay(withWeather: readonly StationSeries[], requested: string): { asOf: string; latestWeather: string | null; weatherNote: string | null } {
  const latestWeather = withWeather.reduce<string | null>((m, s) => (m === null || s.latest! > m ? s.latest : m), null);
  if (latestWeather === null) return { asOf: requested, latestWeather, weatherNote: 'No weather is recorded yet, so overdue mowing cannot be predicted.' };
  if (latestWeather < requested) {
    return { asOf: latestWeather, latestWeather, weatherNote: `No weather after ${dayText(latestWeather)}: heights and overdue flags are as of that day, the latest with weather, not ${dayText(requested)}.` };
  }
  return { asOf: requested, latestWeather, weatherNote: null };
}

/** Daily growth of the stations the visible fields use, from the earliest last mowing; null when no field needs any. */
async function growthForFields(db: Ctx['db'], visibleFields: readonly MapFieldRow[], stationOfSite: ReadonlyMap<number, number>, asOf: string): Promise<Map<number, GrowthTable> | null> {
  const mowed = visibleFields.map((f) => f.lastMowedOn).filter((d): d is string => d !== null && d < asOf);
  const from = mowed.length ? mowed.reduce((a, b) => (a < b ? a : b)) : null;
  const usedStations = [...new Set(visibleFields.map((f) => stationOfSite.get(f.siteId)).filter((id): id is number => id !== undefined))];
  return from && usedStations.length ? growthTables(db, usedStations, from, asOf) : null;
}

interface FieldHeight {
  predicted: number | null;
  overdue: boolean | null;
  overdueSince: string | null;
  daysWithoutWeather: number;
}

/** Unknown height: no mowing on record, or no station with weather near the field. */
const NO_HEIGHT: FieldHeight = { predicted: null, overdue: null, overdueSince: null, daysWithoutWeather: 0 };

/** The grass height grown since the last mowing and whether the one-third rule is overdue; a cut today (or no growth to run) leaves HOC. */
function heightSinceMowing(f: MapFieldRow, days: number, hocMm: number, table: GrowthTable | undefined, asOf: string): FieldHeight {
  if (days <= 0 || !table) return { predicted: hocMm, overdue: false, overdueSince: null, daysWithoutWeather: 0 };
  const r = grownSince(table, f.grass as Grass, f.lastMowedOn!, asOf, hocMm);
  return { predicted: round1(r.heightMm), overdue: r.overdueSince !== null, overdueSince: r.overdueSince, daysWithoutWeather: r.daysWithoutWeather };
}

function toMapField(f: MapFieldRow, hocMm: number, days: number | null, height: FieldHeight, due: { check: Due; mow: MowingDue }): MapField {
  return {
    id: f.id,
    siteId: f.siteId,
    districtId: f.districtId,
    name: f.name,
    sport: f.sport,
    grass: f.grass,
    maintenanceLevel: f.maintenanceLevel,
    status: f.status,
    areaM2: Math.round(f.areaM2),
    longAxisDeg: f.longAxisDeg === null ? null : round1(f.longAxisDeg),
    eastWest: f.longAxisDeg !== null && Math.min(f.longAxisDeg, 180 - f.longAxisDeg) > 45,
    score: f.score,
    scoredOn: f.scoredOn,
    lastMowedOn: f.lastMowedOn,
    daysSinceMowing: days,
    // Exact to 0.001 mm so an eighth of an inch (31.75 mm = 1¼ in) reads back as set.
    hocMm: Math.round(hocMm * 1000) / 1000,
    predictedHeightMm: height.predicted,
    overdue: height.overdue,
    overdueSince: height.overdueSince,
    checkDueOn: due.check.dueOn,
    checkState: due.check.state,
    mowDueOn: due.mow.dueOn,
    mowDueState: due.mow.state,
    mowWaitingForGrowth: due.mow.waitingForGrowth,
    version: f.version,
    geometry: compact(f.geometry),
  };
}

/** The DB's Standards rows as the engine's table; a level without a row keeps the engine default. */
function standardsFrom(rows: { level: number; data: LevelStandard }[]): Standards {
  const table = { ...DEFAULT_STANDARDS };
  for (const level of LEVELS) {
    const row = rows.find((r) => r.level === level);
    if (row) table[level] = row.data;
  }
  return table;
}

/**
 * Cumulative growth per station and grass: cum[i] = growth (mm) of days start+1 … start+i at
 * the grass's default max rate (DEFAULT_PARAMETERS) × GP of the day's mean temperature.
 * Days without weather add nothing and are counted.
 */
interface GrowthTable {
  startDay: number;
  cum: Record<Grass, Float64Array>;
  /** missing[i] = days without weather among start+1 … start+i. */
  missing: Int32Array;
}

async function growthTables(db: Ctx['db'], stationIds: number[], from: string, asOf: string): Promise<Map<number, GrowthTable>> {
  const rows = await db
    .select({ stationId: weatherDays.stationId, date: weatherDays.date, tmaxC: weatherDays.tmaxC, tminC: weatherDays.tminC })
    .from(weatherDays)
    .where(and(inArray(weatherDays.stationId, stationIds), sql`${weatherDays.date} > ${from}`, sql`${weatherDays.date} <= ${asOf}`))
    .orderBy(asc(weatherDays.stationId), asc(weatherDays.date));
  const startDay = isoToDayNumber(from);
  const n = isoToDayNumber(asOf) - startDay;
  const tables = new Map<number, GrowthTable>();
  for (const id of stationIds) {
    const mean = new Array<number | null>(n + 1).fill(null);
    for (const r of rows) if (r.stationId === id) mean[isoToDayNumber(r.date) - startDay] = (r.tmaxC + r.tminC) / 2;
    const cum = {} as Record<Grass, Float64Array>;
    for (const grass of GRASSES) {
      const c = new Float64Array(n + 1);
      const season = grassSeason(grass);
      const rate = DEFAULT_PARAMETERS.maxGrowthMmPerDay[grass];
      for (let i = 1; i <= n; i++) {
        const t = mean[i];
        c[i] = c[i - 1]! + (t === null || t === undefined ? 0 : dailyGrowthMm(rate, t, season));
      }
      cum[grass] = c;
    }
    const missing = new Int32Array(n + 1);
    for (let i = 1; i <= n; i++) missing[i] = missing[i - 1]! + (mean[i] === null ? 1 : 0);
    tables.set(id, { startDay, cum, missing });
  }
  return tables;
}

/** Growth of each day after a cut on `mowedOn` up to `asOf` (mm), from the station's table; none when the cut is outside it. */
function growthAfter(table: GrowthTable | undefined, grass: Grass, mowedOn: string, asOf: string): number[] {
  if (!table) return [];
  const c = table.cum[grass];
  const a = isoToDayNumber(mowedOn) - table.startDay;
  const b = isoToDayNumber(asOf) - table.startDay;
  if (a < 0 || b <= a) return [];
  const out = new Array<number>(b - a);
  for (let i = a + 1; i <= b; i++) out[i - a - 1] = c[i]! - c[i - 1]!;
  return out;
}

/** Height at the end of `asOf` after a cut to HOC on `mowedOn`, and the first day above 1.5 × HOC. */
function grownSince(table: GrowthTable, grass: Grass, mowedOn: string, asOf: string, hocMm: number) {
  const c = table.cum[grass];
  const a = isoToDayNumber(mowedOn) - table.startDay;
  const b = isoToDayNumber(asOf) - table.startDay;
  const base = c[a]!;
  const heightMm = hocMm + (c[b]! - base);
  const allowance = mowTriggerHeightMm(hocMm) - hocMm;
  let overdueSince: string | null = null;
  if (c[b]! - base > allowance + 1e-9) {
    // Cumulative growth never falls: the first day past the trigger by bisection.
    let lo = a + 1;
    let hi = b;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (c[mid]! - base > allowance + 1e-9) hi = mid;
      else lo = mid + 1;
    }
    overdueSince = dayNumberToIso(table.startDay + lo);
  }
  return { heightMm, overdueSince, daysWithoutWeather: table.missing[b]! - table.missing[a]! };
}

/** The bundled vector basemap of the demo city and the configured tile layer, if any. */
export async function basemap(ctx: Ctx, config: { mapTileUrl: string | undefined; mapAttribution: string | undefined }): Promise<BasemapAnswer> {
  authorize(ctx, 'read', 'Field');
  const [row] = await ctx.db.select({ value: settings.value }).from(settings).where(eq(settings.key, 'basemap'));
  return {
    // The seed stores it as GeoJSON (settings values are untyped JSON).
    basemap: (row?.value as BasemapAnswer['basemap'] | undefined) ?? { type: 'FeatureCollection', features: [] },
    tileUrl: config.mapTileUrl ?? null,
    attribution: config.mapAttribution ?? null,
  };
}
