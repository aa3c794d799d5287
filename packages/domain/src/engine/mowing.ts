/**
 * Mowing: the one-third rule, a day-by-day mowing simulation, and mower choice by HOC.
 * One-third rule (common practice): remove no more than a third of the leaf height in one
 * cut, i.e. mow before the grass exceeds 1.5 × HOC (at 2 in HOC, mow before 3 in).
 */
import { dayNumberToIso, isoToDayNumber } from './dates.ts';
import type { Weekday } from './dates.ts';
import { fail, requireNonNegative, requirePositive } from './check.ts';
import { DEFAULT_PARAMETERS } from './standards.ts';
import type { MowerSettings, MowerSpec } from './standards.ts';
import { MM_PER_INCH } from './units.ts';

/** Height (mm) the grass may reach before it must be mowed: 1.5 × HOC (one-third rule). */
export function mowTriggerHeightMm(hocMm: number): number {
  return 1.5 * requirePositive(hocMm, 'invalid_hoc', 'HOC (mm)');
}

export interface CutCheck {
  /** Share of the leaf height removed by cutting from `heightMm` to `hocMm`. */
  removalFraction: number;
  /** More than a third removed: scalping risk. */
  scalpingRisk: boolean;
}

/** Share of leaf removed when grass at `heightMm` is cut to `hocMm`; > 1/3 flags scalping risk (one-third rule). */
export function checkCut(heightMm: number, hocMm: number): CutCheck {
  requirePositive(hocMm, 'invalid_hoc', 'HOC (mm)');
  requirePositive(heightMm, 'invalid_height', 'grass height (mm)');
  const removalFraction = heightMm <= hocMm ? 0 : (heightMm - hocMm) / heightMm;
  return { removalFraction, scalpingRisk: removalFraction > 1 / 3 + 1e-9 };
}

export interface MowingOptions {
  /** ISO date of the first day of the growth series. */
  startDate: string;
  /** Longest interval between mowings (the level's minimum frequency), days. */
  maxIntervalDays?: number;
  /** Minimum mowings per week; turned into a max interval of floor(7 ÷ n) days. */
  minMowingsPerWeek?: number;
  /** Weekdays on which the crew can mow (default every day). */
  mowingDays?: readonly Weekday[];
  /** Days since the last cut at the start (default 0: cut the day before the series). */
  daysSinceCutAtStart?: number;
  /**
   * Least growth above HOC (mm) for a cut forced by the minimum frequency (default 0). Keeps
   * the level's frequency from sending mowers onto dormant turf.
   */
  frequencyMinGrowthMm?: number;
}

export interface MowingEvent {
  date: string;
  dayIndex: number;
  heightBeforeMm: number;
  removalFraction: number;
  scalpingRisk: boolean;
  /** Why this cut: the one-third rule would be broken, or the level's minimum frequency. */
  reason: 'growth' | 'frequency';
}

export interface MowingSimulation {
  hocMm: number;
  triggerHeightMm: number;
  mowings: MowingEvent[];
  /** Days between consecutive cuts (the first from the start of the series). */
  intervalsDays: number[];
  meanIntervalDays: number | null;
  mowingsPerWeek: number;
  /** Cuts forced by growth and by the minimum frequency. */
  growthMowings: number;
  frequencyMowings: number;
  /** First date the grass would exceed 1.5 × HOC if no one mowed; null if never in the series. */
  overdueIfNotMowedDate: string | null;
  /** Dates on which the simulated grass stood above 1.5 × HOC (e.g. no mowing day in time). */
  overdueDates: string[];
  maxHeightMm: number;
}

/**
 * Simulates mowing over a daily growth series (mm/day, e.g. from `dailyGrowthMm`). On each
 * mowing day the field is cut if, before the next mowing day, the grass would exceed
 * 1.5 × HOC (one-third rule) or the interval would exceed the level's maximum. Height after
 * a cut is HOC; growth of day i is added at the end of day i.
 */
export function simulateMowing(hocMm: number, growthMmPerDay: readonly number[], startHeightMm: number, options: MowingOptions): MowingSimulation {
  const cuts: number[] = [];
  const heights: number[] = [];
  const byGrowth: boolean[] = [];
  const overdue: number[] = [];
  const run = runMowing(hocMm, growthMmPerDay, startHeightMm, options, { cuts, heights, byGrowth, overdue });
  const mowings: MowingEvent[] = new Array<MowingEvent>(cuts.length);
  const intervalsDays: number[] = new Array<number>(cuts.length);
  let prev = -1 - (options.daysSinceCutAtStart ?? 0);
  let between = 0;
  for (let k = 0; k < cuts.length; k++) {
    const i = cuts[k] as number;
    const h = heights[k] as number;
    const cut = checkCut(h, hocMm);
    mowings[k] = { date: dayNumberToIso(run.day0 + i), dayIndex: i, heightBeforeMm: h, removalFraction: cut.removalFraction, scalpingRisk: cut.scalpingRisk, reason: byGrowth[k] ? 'growth' : 'frequency' };
    intervalsDays[k] = i - prev;
    if (k > 0) between += i - prev;
    prev = i;
  }
  const n = growthMmPerDay.length;
  return {
    hocMm,
    triggerHeightMm: run.trigger,
    mowings,
    intervalsDays,
    meanIntervalDays: mowings.length > 1 ? between / (mowings.length - 1) : null,
    mowingsPerWeek: run.mowingsPerWeek,
    growthMowings: run.growthMowings,
    frequencyMowings: run.mowings - run.growthMowings,
    overdueIfNotMowedDate: run.overdueIfNotMowedIndex === null ? null : dayNumberToIso(run.day0 + Math.min(run.overdueIfNotMowedIndex, n)),
    overdueDates: overdue.map((i) => dayNumberToIso(run.day0 + i)),
    maxHeightMm: run.maxHeightMm,
  };
}

/** The counts of a mowing run, as a season outlook needs them. */
export interface MowingCounts {
  mowings: number;
  growthMowings: number;
  mowingsPerWeek: number;
  /** Days on which the grass stood above 1.5 × HOC. */
  overdueDays: number;
}

/**
 * The counts of `simulateMowing` without its dates and events: the same run, for outlooks that
 * add up thousands of fields.
 */
export function countMowings(hocMm: number, growthMmPerDay: readonly number[], startHeightMm: number, options: MowingOptions): MowingCounts {
  const run = runMowing(hocMm, growthMmPerDay, startHeightMm, options, null);
  return { mowings: run.mowings, growthMowings: run.growthMowings, mowingsPerWeek: run.mowingsPerWeek, overdueDays: run.overdueDays };
}

interface MowingRun {
  day0: number;
  trigger: number;
  mowings: number;
  growthMowings: number;
  mowingsPerWeek: number;
  overdueDays: number;
  /** Index of the day the unmown grass would first stand above 1.5 × HOC (n: the day after the series), or null. */
  overdueIfNotMowedIndex: number | null;
  maxHeightMm: number;
}

/** The one mowing decision of `simulateMowing` and `countMowings`; records cuts and overdue days when asked. */
function runMowing(
  hocMm: number,
  growthMmPerDay: readonly number[],
  startHeightMm: number,
  options: MowingOptions,
  record: { cuts: number[]; heights: number[]; byGrowth: boolean[]; overdue: number[] } | null,
): MowingRun {
  const trigger = mowTriggerHeightMm(hocMm);
  requirePositive(startHeightMm, 'invalid_height', 'start height (mm)');
  const maxInterval = maxIntervalFrom(options);
  const minGrowthForFrequency = requireNonNegative(options.frequencyMinGrowthMm ?? 0, 'invalid_growth', 'minimum growth for a frequency cut (mm)');
  const mowingDays = options.mowingDays ?? WEEK;
  if (mowingDays.length === 0) fail('invalid_mowing_days', 'at least one mowing day is needed');
  // Weekday flags by index (0 = Sunday); a name that is no weekday allows no day.
  const allowedByWeekday = [false, false, false, false, false, false, false];
  for (const d of mowingDays) {
    const k = WEEK.indexOf(d);
    if (k >= 0) allowedByWeekday[k] = true;
  }
  const n = growthMmPerDay.length;
  const day0 = isoToDayNumber(options.startDate);
  for (let i = 0; i < n; i++) {
    const g = growthMmPerDay[i] as number;
    if (!(g >= 0) || g === Infinity) requireNonNegative(g, 'invalid_growth', 'daily growth (mm)');
  }
  // 1970-01-01 (day 0) was a Thursday (index 4). No closures here: this runs for every field.
  const firstIdx = (((day0 + 4) % 7) + 7) % 7;
  // Index of the next allowed day strictly after i (or n when none left).
  const nextAllowed = new Int32Array(n);
  let next = n;
  for (let i = n - 1; i >= 0; i--) {
    nextAllowed[i] = next;
    if (allowedByWeekday[(firstIdx + i) % 7]) next = i;
  }

  let mowings = 0;
  let growthMowings = 0;
  let overdueDays = 0;
  let height = startHeightMm;
  let lastCut = -1 - (options.daysSinceCutAtStart ?? 0);
  let maxHeight = startHeightMm;
  let overdueIfNotMowed: number | null = null;
  let unmown = startHeightMm;
  for (let i = 0; i < n; i++) {
    if (height > trigger + 1e-9) {
      overdueDays++;
      record?.overdue.push(i);
    }
    if (overdueIfNotMowed === null && unmown > trigger + 1e-9) overdueIfNotMowed = i;
    const today = growthMmPerDay[i] as number;
    if (allowedByWeekday[(firstIdx + i) % 7]) {
      const j = nextAllowed[i] as number;
      // Height at the start of the next mowing day if not cut today (growth of days i..j−1).
      let ahead = height;
      for (let k = i; k < j && k < n; k++) ahead += growthMmPerDay[k] as number;
      const byGrowth = j < n ? ahead > trigger : height + today > trigger;
      const byFrequency = maxInterval !== null && (j < n ? j - lastCut > maxInterval : i - lastCut >= maxInterval);
      const frequencyDue = byFrequency && height - hocMm >= minGrowthForFrequency;
      if ((byGrowth || frequencyDue) && height > hocMm + 1e-9) {
        mowings++;
        if (byGrowth) growthMowings++;
        if (record) {
          record.cuts.push(i);
          record.heights.push(height);
          record.byGrowth.push(byGrowth);
        }
        height = hocMm;
        lastCut = i;
      }
    }
    height += today;
    unmown += today;
    if (height > maxHeight) maxHeight = height;
  }
  if (overdueIfNotMowed === null && unmown > trigger + 1e-9 && n > 0) overdueIfNotMowed = n;
  return { day0, trigger, mowings, growthMowings, mowingsPerWeek: n > 0 ? (mowings / n) * 7 : 0, overdueDays, overdueIfNotMowedIndex: overdueIfNotMowed, maxHeightMm: maxHeight };
}

/**
 * Date the grass passes 1.5 × HOC if no one mows, from its current height and a growth
 * forecast (mm/day from `fromDate`); null if it stays below within the forecast.
 */
export function overdueDate(hocMm: number, currentHeightMm: number, growthMmPerDay: readonly number[], fromDate: string): string | null {
  const trigger = mowTriggerHeightMm(hocMm);
  let h = requirePositive(currentHeightMm, 'invalid_height', 'current height (mm)');
  const day0 = isoToDayNumber(fromDate);
  if (h > trigger) return fromDate;
  for (let i = 0; i < growthMmPerDay.length; i++) {
    h += requireNonNegative(growthMmPerDay[i] as number, 'invalid_growth', 'daily growth (mm)');
    if (h > trigger) return dayNumberToIso(day0 + i + 1);
  }
  return null;
}

const WEEK: readonly Weekday[] = ['sun', 'mon', 'tue', 'wed', 'thu', 'fri', 'sat'];

/** What a level's Standards say about mowing frequency. */
export interface LevelMowingRule {
  /** Least mowings per week in the growing season. */
  minMowingsPerWeek: number;
  /** Longest allowed interval between mowings, days. */
  maxMowingIntervalDays: number;
}

/** The mowing policy every plan and outlook runs `simulateMowing` with. */
export interface MowingPolicy {
  maxIntervalDays: number;
  minMowingsPerWeek: number;
  frequencyMinGrowthMm: number;
}

/**
 * The one mowing policy of the engine, used alike by the season outlook, the week plan and
 * the field page: the one-third rule (cut before 1.5 × HOC), the level's longest interval
 * and its least mowings per week (the shorter of the interval and ⌊7 ÷ minimum⌋ days), and
 * frequency cuts only once the grass has grown a tenth of HOC (department rule, so the
 * frequency does not send mowers onto dormant turf).
 */
export function mowingPolicy(hocMm: number, rule: LevelMowingRule): MowingPolicy {
  requirePositive(hocMm, 'invalid_hoc', 'HOC (mm)');
  return { maxIntervalDays: rule.maxMowingIntervalDays, minMowingsPerWeek: rule.minMowingsPerWeek, frequencyMinGrowthMm: 0.1 * hocMm };
}

/** Longest interval (days) a level allows between cuts: its own maximum or ⌊7 ÷ least mowings per week⌋, whichever is shorter. */
export function levelIntervalDays(rule: LevelMowingRule): number {
  const fromFreq = rule.minMowingsPerWeek > 0 ? Math.max(1, Math.floor(7 / rule.minMowingsPerWeek)) : Infinity;
  return Math.min(rule.maxMowingIntervalDays, fromFreq);
}

function maxIntervalFrom(o: MowingOptions): number | null {
  const max = o.maxIntervalDays === undefined ? Infinity : requirePositive(o.maxIntervalDays, 'invalid_interval', 'maximum mowing interval (days)');
  const both = levelIntervalDays({ maxMowingIntervalDays: max, minMowingsPerWeek: o.minMowingsPerWeek ?? 0 });
  return Number.isFinite(both) ? both : null;
}

/**
 * A HOC as the department sets its mowers: in its unit (in or mm), to the nearest step (an
 * eighth of an inch by default). Working in the setting's own unit keeps 25.4 mm at exactly
 * 1 in, and a stored 25.399999 mm (single-precision database value) at 1 in too.
 */
export function hocSetting(hocMm: number, settings: MowerSettings = DEFAULT_PARAMETERS.mowerSettings): number {
  requirePositive(hocMm, 'invalid_hoc', 'HOC (mm)');
  const step = requirePositive(settings.step, 'invalid_mower_settings', 'mower setting step');
  const value = settings.unit === 'in' ? hocMm / MM_PER_INCH : hocMm;
  return Math.round(value / step) * step;
}

/** A mower setting written in its unit, e.g. "1 in" or "25 mm". */
function settingText(value: number, settings: MowerSettings): string {
  return `${Math.round(value * 1000) / 1000} ${settings.unit}`;
}

/**
 * Reel mower up to the department's reel limit, inclusive (common practice: reel at 1 in and
 * below), rotary above; compared in the unit and step the department sets mowers in.
 */
export function mowerTypeFor(hocMm: number, settings: MowerSettings = DEFAULT_PARAMETERS.mowerSettings): 'reel' | 'rotary' {
  return hocSetting(hocMm, settings) <= settings.reelUpToHoc + 1e-9 ? 'reel' : 'rotary';
}

export interface MowerWarning {
  code: 'hoc_below_range' | 'hoc_above_range' | 'kind_mismatch';
  message: string;
}

/** Warnings when a mower cannot hold a HOC or is the wrong kind for it (common practice). */
export function checkMowerForHoc(mower: Pick<MowerSpec, 'kind' | 'hocMinMm' | 'hocMaxMm'>, hocMm: number, settings: MowerSettings = DEFAULT_PARAMETERS.mowerSettings): MowerWarning[] {
  requirePositive(hocMm, 'invalid_hoc', 'HOC (mm)');
  if (mower.hocMinMm > mower.hocMaxMm) fail('invalid_mower', `mower HOC range is inverted (${mower.hocMinMm}–${mower.hocMaxMm} mm)`);
  const out: MowerWarning[] = [];
  if (hocMm < mower.hocMinMm - 1e-6) out.push({ code: 'hoc_below_range', message: `HOC ${hocMm} mm is below this mower's lowest setting (${mower.hocMinMm} mm)` });
  if (hocMm > mower.hocMaxMm + 1e-6) out.push({ code: 'hoc_above_range', message: `HOC ${hocMm} mm is above this mower's highest setting (${mower.hocMaxMm} mm)` });
  const want = mowerTypeFor(hocMm, settings);
  if (want !== mower.kind) {
    const limit = settingText(settings.reelUpToHoc, settings);
    out.push({
      code: 'kind_mismatch',
      message: want === 'reel' ? `a reel mower is usual at ${limit} and below; this is a ${mower.kind} mower` : `a rotary mower is usual above ${limit}; this is a ${mower.kind} mower`,
    });
  }
  return out;
}
