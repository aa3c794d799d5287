/**
 * Blade care: when a mower's blades (reel and bedknife, or rotary blades) are due for
 * sharpening, from its hour meter. A dull edge tears the leaf instead of cutting it; the torn
 * tips brown and let disease in, so the department sets an interval of use per machine.
 */
import type { EquipmentKind } from '../vocabulary.ts';
import { weekdayOf } from './dates.ts';
import { weekDates, type PlanCrewInput } from './weekgen.ts';

/**
 * Common sharpening intervals, hours of use (common practice, from memory): reel mowers are
 * backlapped or ground every 20–50 h, rotary blades sharpened every 8–25 h. A hint for the
 * equipment form only; the department sets each machine's own interval.
 */
export const COMMON_SHARPEN_INTERVAL_H: Partial<Record<EquipmentKind, { min: number; max: number }>> = {
  reel_mower: { min: 20, max: 50 },
  rotary_mower: { min: 8, max: 25 },
};

/**
 * Time a sharpening job takes at the yard, h (common practice, from memory): about 1.5 h to
 * backlap a reel set and reset the bedknife, about 0.75 h to take off, sharpen, balance and
 * refit rotary blades; 1 h for anything else.
 */
export const SHARPEN_JOB_HOURS: Partial<Record<EquipmentKind, number>> = { reel_mower: 1.5, rotary_mower: 0.75 };
export const DEFAULT_SHARPEN_JOB_HOURS = 1;

/** What the crew is told on every sharpening job (blades cut hands; an engine can turn the blade). */
export const BLADE_CAUTIONS: readonly string[] = [
  'Wear cut-resistant gloves: a blade or reel edge cuts even when it is dull.',
  'Stop the engine, remove the key and disconnect the spark plug wire (or the battery) before touching the blades, so the engine cannot start.',
  'Block the blade or reel so it cannot turn while you loosen it; support a raised deck on stands, never on a jack alone.',
  'Follow the manufacturer\u2019s manual for removal, balance, bolt torque and the reel-to-bedknife setting.',
];

export type BladeState = 'no_interval' | 'ok' | 'due_soon' | 'due';

export interface BladeCare {
  /** Hours run since the last sharpening (hour meter − reading at the last sharpening), h; null without an interval. */
  hoursSince: number | null;
  /** `hoursSince` plus the mowing hours planned on the machine this week, h; null without an interval. */
  hoursByWeekEnd: number | null;
  /** Hours of use left before the interval is reached (negative: past it); null without an interval. */
  hoursLeft: number | null;
  /** due: at or past the interval now; due_soon: the week's planned mowing reaches it; ok; no_interval: the department set none. */
  state: BladeState;
}

export interface BladeMachine {
  /** Hour meter reading now, h. */
  hourMeterH: number;
  /** Hours of use between sharpenings, set by the department per machine; null: not tracked. */
  sharpenIntervalH: number | null;
  /** Hour meter reading at the last sharpening, h; null: never recorded (counted from 0 h). */
  lastSharpenedAtH: number | null;
}

const round1 = (v: number) => Math.round(v * 10) / 10;

/**
 * A mower's blade state. Hours since = hour meter − reading at the last sharpening (a machine
 * never sharpened on record counts from 0 h). Due when the hours since reach the interval;
 * due soon when they do not yet, but adding the mowing hours planned on this machine this
 * week (`plannedWeekHours`, h: the week plan's mowings that name it) reaches it. Planned
 * hours are work hours of the job, taken as engine hours (the drive to the site is not
 * counted: a simplification that errs late by the transport time).
 */
export function bladeCare(m: BladeMachine, plannedWeekHours = 0): BladeCare {
  if (m.sharpenIntervalH === null || !(m.sharpenIntervalH > 0)) return { hoursSince: null, hoursByWeekEnd: null, hoursLeft: null, state: 'no_interval' };
  const since = Math.max(0, m.hourMeterH - (m.lastSharpenedAtH ?? 0));
  const byWeekEnd = since + Math.max(0, plannedWeekHours);
  const state: BladeState = since >= m.sharpenIntervalH ? 'due' : byWeekEnd >= m.sharpenIntervalH ? 'due_soon' : 'ok';
  return { hoursSince: round1(since), hoursByWeekEnd: round1(byWeekEnd), hoursLeft: round1(m.sharpenIntervalH - since), state };
}

/** Yard-job planned hours for sharpening a machine of this kind, h. */
export function sharpenJobHours(kind: EquipmentKind): number {
  return SHARPEN_JOB_HOURS[kind] ?? DEFAULT_SHARPEN_JOB_HOURS;
}

/** A mower as the week plan reads it for blade care. */
export interface SharpenMachine extends BladeMachine {
  id: number;
  name: string;
  kind: EquipmentKind;
  /** The crew the machine is kept with; null: the district's pool. */
  crewId: number | null;
}

/** A sharpening job the week plan puts on the board: yard work on one machine. */
export interface SharpenJob {
  equipmentId: number;
  crewId: number | null;
  plannedDate: string;
  plannedHours: number;
  reason: string;
  details: { hoursSinceSharpening: number; sharpenIntervalH: number; hourMeterH: number };
}

/**
 * The week's sharpening jobs: one for each machine whose blades are due (hours since the
 * last sharpening ≥ its interval) at the start of the week. It goes to the machine's own crew,
 * else the district crew with the most hours a day (ties: the lower id), on that crew's
 * first working day of the week on or after `notBefore` that is not rained out (`closed`:
 * `${crewId}|${date}`), so the blades are sharp before the week's mowing. No crew working
 * that week: the job waits on the first weekday for the foreman to assign. Machines only due
 * soon get no job (the equipment page shows them).
 */
export function planSharpeningJobs(input: {
  weekStart: string;
  machines: readonly SharpenMachine[];
  crews: readonly PlanCrewInput[];
  closed?: ReadonlySet<string>;
  notBefore?: string;
}): SharpenJob[] {
  const dates = weekDates(input.weekStart).filter((d) => !input.notBefore || d >= input.notBefore);
  if (dates.length === 0) return [];
  const byHours = [...input.crews].sort((a, b) => b.hoursPerDay - a.hoursPerDay || a.id - b.id);
  const firstDay = (crew: PlanCrewInput) => dates.find((d) => crew.workDays.includes(weekdayOf(d)) && !input.closed?.has(`${crew.id}|${d}`));
  const jobs: SharpenJob[] = [];
  for (const m of [...input.machines].sort((a, b) => a.id - b.id)) {
    const care = bladeCare(m);
    if (care.state !== 'due' || m.sharpenIntervalH === null) continue;
    const own = input.crews.find((c) => c.id === m.crewId);
    const crew = [own, ...byHours].find((c): c is PlanCrewInput => c !== undefined && firstDay(c) !== undefined);
    jobs.push({
      equipmentId: m.id,
      crewId: crew?.id ?? null,
      plannedDate: (crew && firstDay(crew)) ?? dates[0]!,
      plannedHours: sharpenJobHours(m.kind),
      reason: `Blades due: ${care.hoursSince} h since the last sharpening (every ${m.sharpenIntervalH} h)`,
      details: { hoursSinceSharpening: care.hoursSince!, sharpenIntervalH: m.sharpenIntervalH, hourMeterH: m.hourMeterH },
    });
  }
  return jobs;
}
