/**
 * Cultural work: aeration, overseeding, topdressing and weed control as a program per
 * maintenance level (how many times a season, in which months for cool- and warm-season
 * grass), and when the week plan asks for the next one.
 *
 * Timing windows follow extension practice as the trade states it: cool-season turf is
 * aerated and overseeded while it grows actively in spring and, best, late summer to early
 * autumn; warm-season turf from late spring through summer, never while dormant; broadleaf
 * weeds in cool-season turf are best controlled in autumn (common practice, from memory of
 * university extension turf calendars — confirm against the local extension service).
 * Counts per level are this product's demo defaults (common practice), edited by the department.
 */
import type { GrassSeason } from '../vocabulary.ts';
import { addDaysIso, isoToDayNumber } from './dates.ts';

export const CULTURAL_TASKS = ['aerate', 'overseed', 'topdress', 'weed_control'] as const;
export type CulturalTask = (typeof CULTURAL_TASKS)[number];

export const AERATION_METHODS = ['core', 'solid_tine'] as const;
export type AerationMethod = (typeof AERATION_METHODS)[number];
export const AERATION_METHOD_LABELS: Record<AerationMethod, string> = { core: 'Core (hollow tine)', solid_tine: 'Solid tine' };

/** Months 1–12, both ends included. */
export interface MonthWindow {
  fromMonth: number;
  toMonth: number;
}

/** One cultural task of a level: times a season and the months it may go in, per grass season. */
export interface CulturalProgram {
  timesPerSeason: number;
  cool: MonthWindow;
  warm: MonthWindow;
  /** Aeration only: core (hollow tine, relieves compaction) or solid tine (less disruption in season). */
  method?: AerationMethod;
}

export type CulturalPrograms = Record<CulturalTask, CulturalProgram>;

const w = (fromMonth: number, toMonth: number): MonthWindow => ({ fromMonth, toMonth });
// Windows (common practice, from memory of extension turf calendars): cool-season aeration and
// topdressing April–October while growing, overseeding late August–September is best but
// spring is used on worn goalmouths, so March–October; broadleaf weed control September–October.
// Warm-season: May–August for aeration, seeding and topdressing; weed control April–June.
const programs = (aerate: number, overseed: number, topdress: number, weeds: number, method: AerationMethod): CulturalPrograms => ({
  aerate: { timesPerSeason: aerate, cool: w(4, 10), warm: w(5, 8), method },
  overseed: { timesPerSeason: overseed, cool: w(3, 10), warm: w(5, 7) },
  topdress: { timesPerSeason: topdress, cool: w(4, 10), warm: w(5, 8) },
  weed_control: { timesPerSeason: weeds, cool: w(9, 10), warm: w(4, 6) },
});

/** Demo defaults per level (common practice: more traffic and a higher level, more cultivation). */
export const DEFAULT_CULTURAL: Record<1 | 2 | 3 | 4, CulturalPrograms> = {
  1: programs(3, 2, 2, 1, 'core'),
  2: programs(2, 1, 1, 1, 'core'),
  3: programs(1, 1, 0, 1, 'core'),
  4: programs(0, 0, 0, 0, 'solid_tine'),
};

export const CULTURAL_TASK_WORDS: Record<CulturalTask, string> = {
  aerate: 'aeration',
  overseed: 'overseeding',
  topdress: 'topdressing',
  weed_control: 'weed control',
};

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
/** "April–October" style words of a window. */
export function monthWindowWords(win: MonthWindow): string {
  const a = MONTHS[win.fromMonth - 1] ?? '?';
  const b = MONTHS[win.toMonth - 1] ?? '?';
  return win.fromMonth === win.toMonth ? a : `${a}–${b}`;
}

/** First and last date of a month window in a year (`YYYY-MM-DD`). */
export function windowDates(win: MonthWindow, year: number): { from: string; to: string } {
  const from = `${year}-${String(win.fromMonth).padStart(2, '0')}-01`;
  const next = win.toMonth === 12 ? `${year + 1}-01-01` : `${year}-${String(win.toMonth + 1).padStart(2, '0')}-01`;
  return { from, to: addDaysIso(next, -1) };
}

export interface CulturalDueInput {
  program: CulturalProgram;
  season: GrassSeason;
  /** Monday and Sunday of the planned week. */
  weekStart: string;
  weekEnd: string;
  /** Dates this task was done (or is kept in the plan) this season, any order. */
  doneDates: readonly string[];
}

export type CulturalDue =
  | { due: false; why: 'none_in_program' | 'outside_window' | 'season_complete' | 'not_yet'; done: number; times: number; from: string; to: string; nextFrom: string | null }
  | { due: true; done: number; times: number; from: string; to: string; nextFrom: string };

/**
 * Whether the next application of a cultural task is due in the week. The season is the
 * calendar year of the week's Monday; the window's days are split evenly among the season's
 * applications, so the k-th (k = done + 1) is due from `from + (k − 1) × length ÷ times` to
 * the window's end. Counting what was done (not the calendar) keeps a re-generated week from
 * asking the same application twice.
 */
export function culturalDue(input: CulturalDueInput): CulturalDue {
  const { program, season, weekStart, weekEnd } = input;
  const year = Number(weekStart.slice(0, 4));
  const { from, to } = windowDates(program[season], year);
  const times = program.timesPerSeason;
  const done = input.doneDates.filter((d) => d >= `${year}-01-01` && d <= `${year}-12-31`).length;
  if (times <= 0) return { due: false, why: 'none_in_program', done, times, from, to, nextFrom: null };
  if (done >= times) return { due: false, why: 'season_complete', done, times, from, to, nextFrom: null };
  const length = isoToDayNumber(to) - isoToDayNumber(from) + 1;
  const nextFrom = addDaysIso(from, Math.floor((done * length) / times));
  if (weekEnd < from || weekStart > to) return { due: false, why: 'outside_window', done, times, from, to, nextFrom };
  if (weekEnd < nextFrom) return { due: false, why: 'not_yet', done, times, from, to, nextFrom };
  return { due: true, done, times, from, to, nextFrom };
}

/**
 * Share of a field to overseed: the bare share of its last field check when it has one (worn
 * goalmouths and centre show there), else the department's default share. At least 2 % so a
 * pass is worth the set-up, at most the whole field.
 */
export function overseedShare(lastBarePct: number | null | undefined, defaultShare: number): number {
  const share = lastBarePct !== null && lastBarePct !== undefined && lastBarePct > 0 ? lastBarePct / 100 : defaultShare;
  return Math.min(1, Math.max(0.02, share));
}
