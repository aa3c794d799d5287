/**
 * Outlook: a season projection per field (mowings, labour, N, water, paint, cost) from a
 * daily weather series, aggregation to district and department, and the change when a
 * field moves level. Composes the other engine modules; adds no formula of its own beyond
 * the water-stress bookkeeping documented below.
 */
import type { Clippings, Grass, IrrigationKind, Level, Sport } from '../vocabulary.ts';
import { fail, requireFraction, requireNonNegative, requireRange, requireTmaxTmin } from './check.ts';
import { WEEKDAYS, dayOfYear, isoToDayNumber, weekdayOf } from './dates.ts';
import { et0Hargreaves, et0PenmanMonteithDay, et0Station } from './fao56.ts';
import { annualNitrogen, productForArea } from './feed.ts';
import { WATER_MODIFIER_FLOOR, growthPotential } from './growth.ts';
import { hoursPerMowing } from './labour.ts';
import { defaultTemplateFor, linePlan } from './lines.ts';
import type { LineTemplate } from './lines.ts';
import { countMowings, mowerTypeFor, mowingPolicy, simulateMowing } from './mowing.ts';
import type { MowingOptions, MowingSimulation } from './mowing.ts';
import type { Weekday } from './dates.ts';
import { DEFAULT_PARAMETERS, DEFAULT_STANDARDS, grassSeason, hocFor, levelStandard } from './standards.ts';
import type { DepartmentParameters, Standards } from './standards.ts';
import { departmentTurfKc, effectiveRainMm, schedulingMultiplier, wateringDayMinutes, weekIrrigation } from './water.ts';

/** One day of weather. Optional fields feed FAO-56 Penman–Monteith; without them, Hargreaves. */
export interface DailyWeather {
  date: string;
  tmaxC: number;
  tminC: number;
  rainMm: number;
  rhMaxPct?: number;
  rhMinPct?: number;
  rhMeanPct?: number;
  tdewC?: number;
  windMs?: number;
  windHeightM?: number;
  sunshineH?: number;
  solarMJ?: number;
}

/** A weather series computed once per location and shared by its fields. */
export interface PreparedWeather {
  startDate: string;
  dates: string[];
  tMeanC: Float64Array;
  et0Mm: Float64Array;
  rainMm: Float64Array;
  effectiveRainMm: Float64Array;
  gpCool: Float64Array;
  gpWarm: Float64Array;
  /** Days whose ET0 came from Hargreaves (temperatures only). */
  hargreavesDays: number;
}

/**
 * Prepares a consecutive daily series for a location: ET0 by FAO-56 Penman–Monteith when
 * humidity, wind or radiation data exist (missing parts filled as FAO-56 chapter 3
 * recommends), Hargreaves (FAO-56 eq. 52) when only temperatures exist; effective rain by the
 * TexasET rule; GP for both grass seasons.
 */
export function prepareWeather(days: readonly DailyWeather[], site: { latDeg: number; elevationM: number; coastal?: boolean }): PreparedWeather {
  if (days.length === 0) fail('empty_weather', 'the weather series has no days');
  requireRange(site.latDeg, -90, 90, 'invalid_latitude', 'latitude (°)');
  const n = days.length;
  const w: PreparedWeather = {
    startDate: (days[0] as DailyWeather).date,
    dates: new Array<string>(n),
    tMeanC: new Float64Array(n),
    et0Mm: new Float64Array(n),
    rainMm: new Float64Array(n),
    effectiveRainMm: new Float64Array(n),
    gpCool: new Float64Array(n),
    gpWarm: new Float64Array(n),
    hargreavesDays: 0,
  };
  const station = et0Station(site.latDeg, site.elevationM, site.coastal ?? false);
  let prevDay = Number.NaN;
  let prevDoy = 0;
  for (let i = 0; i < n; i++) {
    const d = days[i] as DailyWeather;
    const dn = isoToDayNumber(d.date);
    if (i > 0 && dn !== prevDay + 1) fail('weather_gap', `weather days must be consecutive: ${d.date} follows ${(days[i - 1] as DailyWeather).date}`);
    prevDay = dn;
    requireTmaxTmin(d.tmaxC, d.tminC);
    requireNonNegative(d.rainMm, 'invalid_rain', `rain on ${d.date} (mm)`);
    // Consecutive days: the day of the year counts on, back to 1 on 1 January.
    const doy = i === 0 || isNewYear(d.date) ? dayOfYear(d.date) : prevDoy + 1;
    prevDoy = doy;
    const hasMore = d.rhMaxPct !== undefined || d.rhMeanPct !== undefined || d.tdewC !== undefined || d.windMs !== undefined || d.sunshineH !== undefined || d.solarMJ !== undefined;
    let et0: number;
    if (hasMore) {
      et0 = et0PenmanMonteithDay(station, doy, d);
    } else {
      et0 = et0Hargreaves(d.tmaxC, d.tminC, site.latDeg, doy);
      w.hargreavesDays++;
    }
    const t = (d.tmaxC + d.tminC) / 2;
    w.dates[i] = d.date;
    w.tMeanC[i] = t;
    w.et0Mm[i] = Math.max(0, et0);
    w.rainMm[i] = d.rainMm;
    w.effectiveRainMm[i] = effectiveRainMm(d.rainMm);
    w.gpCool[i] = growthPotential(t, 'cool');
    w.gpWarm[i] = growthPotential(t, 'warm');
  }
  return w;
}

/** True for an ISO date of 1 January (`????-01-01`). */
function isNewYear(iso: string): boolean {
  return iso.charCodeAt(5) === 48 && iso.charCodeAt(6) === 49 && iso.charCodeAt(8) === 48 && iso.charCodeAt(9) === 49;
}

/** What the outlook needs of a field. */
export interface OutlookField {
  id: string | number;
  districtId?: string | number;
  areaM2: number;
  sport: Sport;
  grass: Grass;
  maintenanceLevel: Level;
  hocOverrideMm?: number | null;
  clippings: Clippings;
  irrigation: IrrigationKind;
  /** Field's calibrated max growth rate (mm/day at GP = 1); default from the parameters. */
  maxGrowthMmPerDay?: number;
  /** Line layout; default the sport's template (none for lawns and multi-use). */
  lineTemplate?: LineTemplate | null;
  distributionUniformity?: number;
  /** Years since the turf was established (returned clippings save more N on older turf); unknown: young turf. */
  turfAgeYears?: number | null;
}

export interface OutlookTotals {
  fields: number;
  areaM2: number;
  mowings: number;
  mowingHours: number;
  lineHours: number;
  labourHours: number;
  nKg: number;
  productKg: number;
  waterM3: number;
  /** Mixed paint (concentrate + water) of the season's first coats and touch-ups, L. */
  paintMixedL: number;
  paintConcentrateL: number;
  cost: { labour: number; water: number; paint: number; fertiliser: number; total: number };
}

export interface FieldOutlook extends OutlookTotals {
  fieldId: string | number;
  districtId: string | number | null;
  level: Level;
  days: number;
  hocMm: number;
  mowerKind: 'reel' | 'rotary';
  mowingsPerWeek: number;
  overdueDays: number;
  nGPerM2: number;
  grossIrrigationMm: number;
  etcMm: number;
}

/** Days of rain and ETc the water-stress modifier looks back over (department model). */
export const WATER_STRESS_WINDOW_DAYS = 14;

/** The day-by-day part of a field's outlook: growth, ETc and irrigation need. */
export interface FieldDailySeries {
  season: 'cool' | 'warm';
  /** The department's turf Kc used (`departmentTurfKc`). */
  kc: number;
  /** Share of ETc irrigation replaces (0 when the field or its level is not irrigated). */
  share: number;
  /** Maximum growth rate used, mm/day at GP = 1. */
  gmaxMmPerDay: number;
  /** Lower-quarter distribution uniformity. */
  du: number;
  gp: Float64Array;
  /** Predicted vertical growth, mm/day (Gmax × GP × 14-day water modifier). */
  growthMm: number[];
  etcMm: Float64Array;
  /** Gross irrigation need of each day, mm: max(0, share × ETc − effective rain) × SM (0 when not irrigated). */
  grossNeedMm: Float64Array;
  /** Gross depth the week plan schedules on each day, mm (on the department's watering days). */
  irrigationMm: Float64Array;
  /**
   * Gross depth scheduled per week, mm: weeks run Monday to Sunday as in the week plan; the
   * first and last may be partial and count only days of the series.
   */
  weeklyGrossMm: number[];
}

/**
 * Daily growth and water for a field over a prepared weather series, as `fieldOutlook` and
 * the week plan use them. Kc: the department's turf Kc (`departmentTurfKc`), ETc = Kc × ET0.
 * Irrigation: each Monday-to-Sunday week's need (`weekIrrigation`: share × ΣETc − Σ effective
 * rain, × SM) is scheduled on the department's watering days as the week plan schedules it
 * (`wateringDayMinutes`, cycle and soak cap). Growth = Gmax × GP × water modifier, where the
 * modifier is (effective rain + scheduled irrigation ÷ SM, the depth counted toward the
 * need) ÷ ETc over the last 14 days (department model).
 */
export function fieldDailySeries(field: OutlookField, weather: PreparedWeather, standards: Standards = DEFAULT_STANDARDS, params: DepartmentParameters = DEFAULT_PARAMETERS): FieldDailySeries {
  const season = grassSeason(field.grass);
  const std = levelStandard(field.maintenanceLevel, standards);
  const n = weather.dates.length;
  const kc = departmentTurfKc(season, std.reducedKc, params.turfKc ?? DEFAULT_PARAMETERS.turfKc);
  const share = field.irrigation !== 'none' && std.irrigationShareOfEtc !== null ? std.irrigationShareOfEtc : 0;
  const gmax = requireNonNegative(field.maxGrowthMmPerDay ?? params.maxGrowthMmPerDay[field.grass], 'invalid_growth_rate', 'maximum growth rate (mm/day)');
  const gp = season === 'cool' ? weather.gpCool : weather.gpWarm;
  const du = field.distributionUniformity ?? params.irrigation.distributionUniformity;
  const sm = schedulingMultiplier(du);

  const growth = new Array<number>(n);
  const etcDaily = new Float64Array(n);
  const grossDaily = new Float64Array(n);
  const irrigation = new Float64Array(n);
  const weeklyGrossMm: number[] = [];
  const eff = weather.effectiveRainMm;
  for (let i = 0; i < n; i++) etcDaily[i] = kc * Math.max(0, weather.et0Mm[i] as number);

  if (share > 0) {
    requireFraction(share, 'invalid_share', 'share of ETc', true);
    const irr = { ...DEFAULT_PARAMETERS.irrigation, ...params.irrigation };
    const planning = params.planning ?? DEFAULT_PARAMETERS.planning;
    const wateringPos = wateringPositions(planning.wateringDays);
    let monday = firstMondayIndex(weather);
    for (; monday < n; monday += 7) {
      const a = Math.max(0, monday);
      const b = Math.min(n, monday + 7);
      let etc = 0;
      let rain = 0;
      for (let i = a; i < b; i++) {
        const e = etcDaily[i] as number;
        const r = eff[i] as number;
        etc += e;
        rain += r;
        // netIrrigationMm for one day, inline: this runs for every day of every field.
        grossDaily[i] = Math.max(0, share * e - r) * sm;
      }
      const week = weekIrrigation(etc, rain, share, du, planning.minIrrigationMm);
      let applied = 0;
      if (week.scheduled) {
        const depth = (wateringDayMinutes(week.grossMm, wateringPos.length, irr.precipRateMmPerH, irr.maxRunMinPerCycle, irr.maxCyclesPerDay) / 60) * irr.precipRateMmPerH;
        for (const p of wateringPos) {
          const i = monday + p;
          if (i < 0 || i >= n) continue;
          irrigation[i] = depth;
          applied += depth;
        }
      }
      weeklyGrossMm.push(applied);
    }
  }

  let etcWindow = 0;
  let supplyWindow = 0;
  for (let i = 0; i < n; i++) {
    etcWindow += etcDaily[i] as number;
    supplyWindow += (eff[i] as number) + (irrigation[i] as number) / sm;
    if (i >= WATER_STRESS_WINDOW_DAYS) {
      const k = i - WATER_STRESS_WINDOW_DAYS;
      etcWindow -= etcDaily[k] as number;
      supplyWindow -= (eff[k] as number) + (irrigation[k] as number) / sm;
    }
    // waterModifier(supply, ETc), inline.
    const demand = Math.max(0, etcWindow);
    const modifier = demand === 0 ? 1 : Math.max(WATER_MODIFIER_FLOOR, Math.min(1, Math.max(0, supplyWindow) / demand));
    growth[i] = gmax * (gp[i] as number) * modifier;
  }
  return { season, kc, share, gmaxMmPerDay: gmax, du, gp, growthMm: growth, etcMm: etcDaily, grossNeedMm: grossDaily, irrigationMm: irrigation, weeklyGrossMm };
}

const mondayIndexOf = new WeakMap<PreparedWeather, number>();
/** Index of the Monday on or before a series' first day (0 or negative), once per series. */
function firstMondayIndex(weather: PreparedWeather): number {
  let m = mondayIndexOf.get(weather);
  if (m === undefined) {
    m = -((WEEKDAYS.indexOf(weekdayOf(weather.startDate)) + 6) % 7);
    mondayIndexOf.set(weather, m);
  }
  return m;
}

const positionsOf = new WeakMap<readonly Weekday[], number[]>();
/** Positions (0 = Monday) of the watering days in a Monday-to-Sunday week, once per setting. */
function wateringPositions(days: readonly Weekday[]): number[] {
  let p = positionsOf.get(days);
  if (!p) {
    p = [...new Set(days)].map((d) => (WEEKDAYS.indexOf(d) + 6) % 7).sort((a, b) => a - b);
    positionsOf.set(days, p);
  }
  return p;
}

/** Options of a season outlook. */
export interface OutlookOptions {
  /** Weekdays the crews mow (default every day); the week plan uses the district crews' working days. */
  mowingDays?: readonly Weekday[];
}

/**
 * The season's mowings of a field: `simulateMowing` over the field's predicted growth from
 * the first day of weather (cut to HOC the day before), with the engine's one mowing policy
 * (`mowingPolicy`: one-third rule, the level's longest interval and least mowings per week),
 * the same run the week plan makes week by week.
 */
export function fieldMowingSimulation(
  field: OutlookField,
  weather: PreparedWeather,
  standards: Standards = DEFAULT_STANDARDS,
  params: DepartmentParameters = DEFAULT_PARAMETERS,
  options: OutlookOptions = {},
  daily: FieldDailySeries = fieldDailySeries(field, weather, standards, params),
): MowingSimulation {
  const hocMm = hocFor(field, standards);
  return simulateMowing(hocMm, daily.growthMm, hocMm, outlookMowingOptions(hocMm, field, weather, standards, options));
}

/** The options of the outlook's mowing run: from the first day of weather, with the one mowing policy. */
function outlookMowingOptions(hocMm: number, field: OutlookField, weather: PreparedWeather, standards: Standards, options: OutlookOptions): MowingOptions {
  const policy = mowingPolicy(hocMm, levelStandard(field.maintenanceLevel, standards));
  return { startDate: weather.startDate, ...policy, ...(options.mowingDays ? { mowingDays: options.mowingDays } : {}) };
}

/**
 * Season projection for one field over a prepared weather series.
 * Growth: Gmax × GP × water modifier, where the modifier is (effective rain + scheduled
 * irrigation) ÷ ETc over the last 14 days (department model). Mowing:
 * `fieldMowingSimulation` (the engine's one mowing policy). N: annual N pro rata to the
 * series' days (÷ 365). Water: the gross depth the week plan schedules (each week's net need
 * × SM on the watering days). Paint: a first coat at the start, then a touch-up every repaint
 * interval of the level (`linePlan`).
 */
export function fieldOutlook(
  field: OutlookField,
  weather: PreparedWeather,
  standards: Standards = DEFAULT_STANDARDS,
  params: DepartmentParameters = DEFAULT_PARAMETERS,
  options: OutlookOptions = {},
): FieldOutlook {
  requireNonNegative(field.areaM2, 'invalid_area', 'field area (m²)');
  const std = levelStandard(field.maintenanceLevel, standards);
  const hocMm = hocFor(field, standards);
  const n = weather.dates.length;
  const daily = fieldDailySeries(field, weather, standards, params);
  const { share } = daily;
  let grossTotal = 0;
  for (const v of daily.weeklyGrossMm) grossTotal += v;
  let etcTotal = 0;
  for (let i = 0; i < n; i++) etcTotal += daily.etcMm[i] as number;

  // The counts of `fieldMowingSimulation`'s run, without building a date per cut.
  const sim = countMowings(hocMm, daily.growthMm, hocMm, outlookMowingOptions(hocMm, field, weather, standards, options));
  const mowerKind = mowerTypeFor(hocMm, params.mowerSettings);
  const mowingHours = sim.mowings * hoursPerMowing(field.areaM2, params.mowers[mowerKind]);

  const nYear = annualNitrogen({ grass: field.grass, level: field.maintenanceLevel, clippings: field.clippings, irrigated: share > 0, turfAgeYears: field.turfAgeYears ?? null }, standards);
  const nGPerM2 = nYear.gPerM2 * Math.min(1, n / 365);
  const product = productForArea(nGPerM2, params.fertiliserProduct, field.areaM2, params.fertiliserBagKg, params.costs.fertiliserPerKg);

  const template = std.lineRepaintDays === null ? null : field.lineTemplate === undefined ? cachedTemplate(field.sport) : field.lineTemplate;
  const lines = template ? linePlan(template, params.lines, { days: n, repaintDays: std.lineRepaintDays }) : null;
  const lineHours = lines ? lines.seasonHours : 0;
  const paintConcentrateL = lines ? lines.seasonConcentrateLitres : 0;
  const paintMixedL = lines ? lines.seasonMixedLitres : 0;

  const waterM3 = (grossTotal * field.areaM2) / 1000;
  const labourHours = mowingHours + lineHours;
  const c = params.costs;
  const cost = {
    labour: labourHours * c.labourPerHour,
    water: waterM3 * c.waterPerM3,
    paint: paintConcentrateL * c.paintPerLitre,
    fertiliser: product.cost,
    total: 0,
  };
  cost.total = cost.labour + cost.water + cost.paint + cost.fertiliser;
  return {
    fieldId: field.id,
    districtId: field.districtId ?? null,
    level: field.maintenanceLevel,
    days: n,
    hocMm,
    mowerKind,
    mowingsPerWeek: sim.mowingsPerWeek,
    overdueDays: sim.overdueDays,
    nGPerM2,
    grossIrrigationMm: grossTotal,
    etcMm: etcTotal,
    fields: 1,
    areaM2: field.areaM2,
    mowings: sim.mowings,
    mowingHours,
    lineHours,
    labourHours,
    nKg: (nGPerM2 * field.areaM2) / 1000,
    productKg: product.productKg,
    waterM3,
    paintMixedL,
    paintConcentrateL,
    cost,
  };
}

const templateCache = new Map<Sport, LineTemplate | null>();
/** Default templates are pure functions of the sport, so one copy serves every field. */
function cachedTemplate(sport: Sport): LineTemplate | null {
  if (!templateCache.has(sport)) templateCache.set(sport, defaultTemplateFor(sport));
  return templateCache.get(sport) ?? null;
}

function emptyTotals(): OutlookTotals {
  return { fields: 0, areaM2: 0, mowings: 0, mowingHours: 0, lineHours: 0, labourHours: 0, nKg: 0, productKg: 0, waterM3: 0, paintMixedL: 0, paintConcentrateL: 0, cost: { labour: 0, water: 0, paint: 0, fertiliser: 0, total: 0 } };
}

function addInto(t: OutlookTotals, r: OutlookTotals, sign = 1): void {
  t.fields += sign * r.fields;
  t.areaM2 += sign * r.areaM2;
  t.mowings += sign * r.mowings;
  t.mowingHours += sign * r.mowingHours;
  t.lineHours += sign * r.lineHours;
  t.labourHours += sign * r.labourHours;
  t.nKg += sign * r.nKg;
  t.productKg += sign * r.productKg;
  t.waterM3 += sign * r.waterM3;
  t.paintMixedL += sign * r.paintMixedL;
  t.paintConcentrateL += sign * r.paintConcentrateL;
  t.cost.labour += sign * r.cost.labour;
  t.cost.water += sign * r.cost.water;
  t.cost.paint += sign * r.cost.paint;
  t.cost.fertiliser += sign * r.cost.fertiliser;
  t.cost.total += sign * r.cost.total;
}

/** Totals per district (by `districtId`, 'none' when missing) and for the department. */
export function aggregateOutlooks(results: ReadonlyArray<OutlookTotals & { districtId?: string | number | null }>): { byDistrict: Record<string, OutlookTotals>; department: OutlookTotals } {
  const byDistrict: Record<string, OutlookTotals> = {};
  const department = emptyTotals();
  for (const r of results) {
    const key = String(r.districtId ?? 'none');
    const t = (byDistrict[key] ??= emptyTotals());
    addInto(t, r);
    addInto(department, r);
  }
  return { byDistrict, department };
}

/** Outlook at two levels and the change (to − from). */
export function levelChangeDelta(
  field: OutlookField,
  fromLevel: Level,
  toLevel: Level,
  weather: PreparedWeather,
  standards: Standards = DEFAULT_STANDARDS,
  params: DepartmentParameters = DEFAULT_PARAMETERS,
): { from: FieldOutlook; to: FieldOutlook; delta: OutlookTotals } {
  const from = fieldOutlook({ ...field, maintenanceLevel: fromLevel }, weather, standards, params);
  const to = fieldOutlook({ ...field, maintenanceLevel: toLevel }, weather, standards, params);
  const delta = emptyTotals();
  addInto(delta, to);
  addInto(delta, from, -1);
  return { from, to, delta };
}
