/**
 * Water budget: ETc for turf, effective rain, net and gross irrigation need, run time,
 * volume, and a weekly schedule within the allowed watering days.
 */
import type { GrassSeason } from '../vocabulary.ts';
import { fail, requireFraction, requireNonNegative, requirePositive } from './check.ts';
import type { Weekday } from './dates.ts';
import { WEEKDAYS } from './dates.ts';
import { inToMm, mmToIn } from './units.ts';

/**
 * Turf crop coefficients of FAO-56 Table 12 (turf grass, cool / warm season). They describe a
 * full cover of grass; the engine budgets with the department's turf Kc (`departmentTurfKc`)
 * and keeps this table as the published reference.
 */
export const TURF_KC: Record<GrassSeason, { ini: number; mid: number; end: number }> = {
  cool: { ini: 0.9, mid: 0.95, end: 0.95 },
  warm: { ini: 0.8, mid: 0.85, end: 0.85 },
};
/** FAO-56 Table 12 note: reduce turf Kc by 0.10 under careful water management where fast growth is not wanted. */
export const TURF_KC_REDUCTION = 0.1;

/** Kc for turf from FAO-56 Table 12 (full grass cover), optionally reduced by 0.10. Reference values, not the budget's. */
export function turfKc(season: GrassSeason, options: { reduced?: boolean; stage?: 'ini' | 'mid' | 'end' } = {}): number {
  const row = TURF_KC[season];
  if (!row) fail('unknown_season', `grass season must be cool or warm (got ${JSON.stringify(season)})`);
  const kc = row[options.stage ?? 'mid'];
  return options.reduced ? kc - TURF_KC_REDUCTION : kc;
}

/** The department's turf crop coefficients (annual planning values) and its reduction for levels that keep growth slow. */
export interface TurfKcSettings {
  cool: number;
  warm: number;
  /** Subtracted where a level asks for a reduced Kc (FAO-56 Table 12 note: 0.10). */
  reducedBy: number;
}

/**
 * Kc the water budget uses: the department's annual turf coefficient for the grass season
 * (defaults 0.8 cool-season, 0.6 warm-season: University of California ANR turfgrass water
 * guidance, Meyer et al. 1985), less the department's reduction where the level asks for it.
 */
export function departmentTurfKc(season: GrassSeason, reduced: boolean, settings: TurfKcSettings): number {
  const base = settings[season];
  if (base === undefined) fail('unknown_season', `grass season must be cool or warm (got ${JSON.stringify(season)})`);
  requirePositive(base, 'invalid_kc', `${season}-season turf Kc`);
  const kc = reduced ? base - requireNonNegative(settings.reducedBy, 'invalid_kc', 'Kc reduction') : base;
  return requirePositive(kc, 'invalid_kc', `reduced ${season}-season turf Kc`);
}

/** ETc = Kc × ET0, mm/day (FAO-56 eq. 56). */
export function cropEvapotranspiration(kc: number, et0Mm: number): number {
  requirePositive(kc, 'invalid_kc', 'Kc');
  return kc * Math.max(0, et0Mm);
}

/**
 * Effective rain for one rain event or day (mm), by the Texas A&M TexasET network rule:
 * the first 0.1 in is lost, 0.1–1 in counts in full, 1–2 in at two-thirds, above 2 in
 * nothing more.
 */
export function effectiveRainMm(rainMm: number): number {
  requireNonNegative(rainMm, 'invalid_rain', 'rain (mm)');
  const r = mmToIn(rainMm);
  let eff: number;
  if (r <= 0.1) eff = 0;
  else if (r <= 1) eff = r - 0.1;
  else if (r <= 2) eff = 0.9 + ((r - 1) * 2) / 3;
  else eff = 0.9 + 2 / 3;
  return inToMm(eff);
}

/** Net irrigation need (mm) over a period: max(0, share × ΣETc − Σ effective rain). */
export function netIrrigationMm(etcMm: number, effectiveRainTotalMm: number, shareOfEtc = 1): number {
  requireNonNegative(etcMm, 'invalid_water', 'ETc (mm)');
  requireNonNegative(effectiveRainTotalMm, 'invalid_rain', 'effective rain (mm)');
  requireFraction(shareOfEtc, 'invalid_share', 'share of ETc', true);
  return Math.max(0, shareOfEtc * etcMm - effectiveRainTotalMm);
}

/** Low-quarter distribution uniformity: mean of the lowest quarter of catch cans ÷ overall mean (UC Davis catch-can audits). */
export function distributionUniformityLowQuarter(catchCans: readonly number[]): number {
  if (catchCans.length < 4) fail('invalid_catch_cans', `a catch-can audit needs at least 4 cans (got ${catchCans.length})`);
  for (const c of catchCans) requireNonNegative(c, 'invalid_catch_cans', 'catch-can depth');
  const sorted = [...catchCans].sort((a, b) => a - b);
  const q = Math.max(1, Math.floor(sorted.length / 4));
  const mean = sorted.reduce((s, v) => s + v, 0) / sorted.length;
  if (mean === 0) fail('invalid_catch_cans', 'all catch cans are empty');
  const low = sorted.slice(0, q).reduce((s, v) => s + v, 0) / q;
  return low / mean;
}

/**
 * Scheduling multiplier SM = 1 ÷ (0.4 + 0.6 × DU_LQ), with DU_LQ the lower-quarter
 * distribution uniformity (irrigation associations' teaching; from memory). SM(0.70) = 1.22.
 */
export function schedulingMultiplier(duLowQuarter: number): number {
  requireFraction(duLowQuarter, 'invalid_du', 'DU');
  return 1 / (0.4 + 0.6 * duLowQuarter);
}

/**
 * Gross irrigation (mm) = net need × SM, SM = 1 ÷ (0.4 + 0.6 × DU_LQ) from the lower-quarter
 * DU: the engine's one method for distribution uniformity (the run time that brings most of
 * the area to the net need without soaking the whole field to the driest quarter's need).
 */
export function grossIrrigationMm(netMm: number, duLowQuarter: number): number {
  requireNonNegative(netMm, 'invalid_water', 'net need (mm)');
  return netMm * schedulingMultiplier(duLowQuarter);
}

/** Precipitation rate (in/h) = 96.25 × flow (gpm) ÷ area (ft²) (common practice; 96.25 = 231 in³/gal × 60 ÷ 144). */
export function precipitationRateInPerH(flowGpm: number, areaFt2: number): number {
  requireNonNegative(flowGpm, 'invalid_flow', 'flow (gpm)');
  return (96.25 * flowGpm) / requirePositive(areaFt2, 'invalid_area', 'zone area (ft²)');
}

/** Metric equivalent: precipitation rate (mm/h) = 60 × flow (L/min) ÷ area (m²), since 1 L/m² = 1 mm. */
export function precipitationRateMmPerH(flowLpm: number, areaM2: number): number {
  requireNonNegative(flowLpm, 'invalid_flow', 'flow (L/min)');
  return (60 * flowLpm) / requirePositive(areaM2, 'invalid_area', 'zone area (m²)');
}

/** Run time (min) to apply `grossMm` at a precipitation rate (mm/h). */
export function runTimeMinutes(grossMm: number, precipRateMmPerH: number): number {
  requireNonNegative(grossMm, 'invalid_water', 'gross depth (mm)');
  return (grossMm / requirePositive(precipRateMmPerH, 'invalid_precip_rate', 'precipitation rate (mm/h)')) * 60;
}

/** Water volume (L) for a depth (mm) over an area (m²). */
export function irrigationVolumeLitres(depthMm: number, areaM2: number): number {
  requireNonNegative(depthMm, 'invalid_water', 'depth (mm)');
  return depthMm * requireNonNegative(areaM2, 'invalid_area', 'area (m²)');
}

export interface ScheduleOptions {
  /** Gross depth to apply in the week, mm. */
  grossMmPerWeek: number;
  precipRateMmPerH: number;
  /** Weekdays watering is allowed (local restrictions), e.g. ['mon', 'thu']. */
  allowedDays: readonly Weekday[];
  /** Longest single cycle before runoff (cycle and soak), minutes. */
  maxRunMinPerCycle: number;
  /** Most cycles a zone may run on one day (default 4). */
  maxCyclesPerDay?: number;
}

export interface ScheduleDay {
  day: Weekday;
  cycles: number;
  minutesPerCycle: number;
  totalMinutes: number;
  depthMm: number;
}

export interface WeeklySchedule {
  days: ScheduleDay[];
  totalMinutes: number;
  appliedMm: number;
  /** Depth the restrictions leave unapplied, mm (0 when the need fits). */
  shortfallMm: number;
}

/**
 * Weekly schedule: the week's gross depth split evenly over the allowed days, each day's run
 * time split into equal cycles no longer than the max run time (cycle and soak), capped at
 * `maxCyclesPerDay`; what does not fit is reported as shortfall.
 */
export function weeklyIrrigationSchedule(o: ScheduleOptions): WeeklySchedule {
  requireNonNegative(o.grossMmPerWeek, 'invalid_water', 'gross depth per week (mm)');
  requirePositive(o.maxRunMinPerCycle, 'invalid_run_time', 'max run time per cycle (min)');
  const maxCycles = requirePositive(o.maxCyclesPerDay ?? 4, 'invalid_cycles', 'max cycles per day');
  const days = [...new Set(o.allowedDays)];
  for (const d of days) if (!WEEKDAYS.includes(d)) fail('invalid_weekday', `unknown weekday ${JSON.stringify(d)}`);
  if (days.length === 0) fail('no_watering_days', 'no watering day is allowed this week');
  days.sort((a, b) => WEEKDAYS.indexOf(a) - WEEKDAYS.indexOf(b));
  const dayMin = wateringDayMinutes(o.grossMmPerWeek, days.length, o.precipRateMmPerH, o.maxRunMinPerCycle, maxCycles);
  const cycles = dayMin === 0 ? 0 : Math.ceil(dayMin / o.maxRunMinPerCycle - 1e-9);
  const out: ScheduleDay[] = days.map((day) => ({
    day,
    cycles,
    minutesPerCycle: cycles ? dayMin / cycles : 0,
    totalMinutes: dayMin,
    depthMm: (dayMin / 60) * o.precipRateMmPerH,
  }));
  const appliedMm = out.reduce((s, d) => s + d.depthMm, 0);
  return { days: out, totalMinutes: dayMin * days.length, appliedMm, shortfallMm: Math.max(0, o.grossMmPerWeek - appliedMm) };
}

/**
 * Minutes of one watering day when a week's gross depth is split evenly over `days` allowed
 * days, capped at `maxCycles` cycles of `maxRunMin` (cycle and soak). The one rule behind
 * `weeklyIrrigationSchedule` and the outlook's scheduled irrigation.
 */
export function wateringDayMinutes(grossMmPerWeek: number, days: number, precipRateMmPerH: number, maxRunMin: number, maxCycles: number): number {
  if (days <= 0) return 0;
  return Math.min(runTimeMinutes(grossMmPerWeek / days, precipRateMmPerH), maxCycles * maxRunMin);
}

/** What the water budget plans for one week of a field. */
export interface WeekIrrigation {
  /** Net need, mm: max(0, share × ΣETc − Σ effective rain). */
  netMm: number;
  /** Gross need, mm: net × SM. */
  grossMm: number;
  /** True when the gross need reaches the department's least depth worth watering. */
  scheduled: boolean;
}

/**
 * A week's water budget as the week plan schedules it: net need = share × ΣETc − Σ effective
 * rain (never below 0), gross = net × SM (`grossIrrigationMm`), watered only when the gross
 * need reaches the department's least depth worth an order.
 */
export function weekIrrigation(etcMm: number, effectiveRainTotalMm: number, shareOfEtc: number, duLowQuarter: number, minIrrigationMm: number): WeekIrrigation {
  const netMm = netIrrigationMm(etcMm, effectiveRainTotalMm, shareOfEtc);
  const grossMm = grossIrrigationMm(netMm, duLowQuarter);
  return { netMm, grossMm, scheduled: grossMm > 0 && grossMm >= minIrrigationMm };
}
