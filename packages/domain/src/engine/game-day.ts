/**
 * Game-day preparation: the steps that make a field ready for a booking (mow at the level's
 * HOC in the chosen pattern, colourant, lines, a logo, a last field check) and the days and
 * crews they go on in the working days before it.
 *
 * Order of the work (common practice): mow first, so paint and colourant are not cut off;
 * colourant before the lines, so the lines go on top; a logo after the lines it is set out
 * from; the field check last, on what the players will find.
 */
import type { UnitSystem, WorkTask } from '../vocabulary.ts';
import { L_PER_US_GALLON, M2_PER_FT2 } from './units.ts';
import { addDaysIso, isoToDayNumber, weekdayOf } from './dates.ts';
import type { Weekday } from './dates.ts';
import { fail } from './check.ts';

export const GAME_DAY_STEPS = ['mow', 'colourant', 'paint_lines', 'logo', 'field_check'] as const;
export type GameDayStep = (typeof GAME_DAY_STEPS)[number];
export const GAME_DAY_STEP_LABELS: Record<GameDayStep, string> = {
  mow: 'Mow at the level’s HOC',
  colourant: 'Colourant',
  paint_lines: 'Paint the lines',
  logo: 'Paint the logo',
  field_check: 'Field check',
};
/** What the partner reads for each step (no hours, no costs). */
export const GAME_DAY_STEP_PUBLIC: Record<GameDayStep, string> = {
  mow: 'The grass is mowed to playing height',
  colourant: 'The turf is coloured for the event',
  paint_lines: 'The lines are painted',
  logo: 'The logo is painted',
  field_check: 'The field is checked for safe play',
};
/** The work order task each step becomes; a logo is painting work with the line marker. */
export const GAME_DAY_STEP_TASK: Record<GameDayStep, WorkTask> = {
  mow: 'mow',
  colourant: 'colourant',
  paint_lines: 'paint_lines',
  logo: 'paint_lines',
  field_check: 'field_check',
};

/** US fluid ounce in millilitres (US customary: 1/128 US gallon of 231 in³). */
export const ML_PER_US_FL_OZ = 29.5735295625;

/**
 * Product a colourant application takes, in litres: rate (mL of product per m²) × area (m²)
 * ÷ 1000. The label's rate decides; this is the arithmetic only.
 */
export function colourantLitres(rateMlPerM2: number, areaM2: number): number {
  if (!(rateMlPerM2 > 0) || !(areaM2 > 0)) fail('invalid_colourant', 'a colourant needs a rate and an area above zero');
  return (rateMlPerM2 * areaM2) / 1000;
}

/**
 * Spraying capacity of a small turf boom sprayer, m²/h: 3 m boom × 5 km/h × 0.7 field
 * efficiency = 10,500 m²/h (common practice; a department can time its own sprayer). Plus
 * half an hour to mix, fill and rinse (common practice).
 */
export const COLOURANT_SPRAY_M2_PER_H = 10_500;
export const COLOURANT_MIX_HOURS = 0.5;

/** Crew hours to colour `areaM2` of turf (h): spraying at `COLOURANT_SPRAY_M2_PER_H` plus mixing and rinsing. */
export function colourantHours(areaM2: number): number {
  if (!(areaM2 > 0)) fail('invalid_colourant', 'a colourant needs an area above zero');
  return Math.round((areaM2 / COLOURANT_SPRAY_M2_PER_H + COLOURANT_MIX_HOURS) * 100) / 100;
}

/**
 * A colourant's rate, area and amount in the reader's units: metric mL/m², m², L; imperial
 * fl oz per 1,000 ft² (the usual label unit in the US), ft², US gal.
 */
export function colourantFacts(c: { rateMlPerM2: number; areaM2: number }, units: UnitSystem): { rate: string; area: string; amount: string } {
  const litres = colourantLitres(c.rateMlPerM2, c.areaM2);
  const n = (v: number, d: number) => v.toLocaleString('en-US', { minimumFractionDigits: d, maximumFractionDigits: d });
  if (units === 'metric') return { rate: `${n(c.rateMlPerM2, 1)} mL/m²`, area: `${n(c.areaM2, 0)} m²`, amount: `${n(litres, 1)} L` };
  const flOzPer1000Ft2 = (c.rateMlPerM2 * 1000 * M2_PER_FT2) / ML_PER_US_FL_OZ;
  return { rate: `${n(flOzPer1000Ft2, 1)} fl oz per 1,000 ft²`, area: `${n(c.areaM2 / M2_PER_FT2, 0)} ft²`, amount: `${n(litres / L_PER_US_GALLON, 1)} gal` };
}

/** Hours to set out and paint one logo with a stencil or grid (common practice planning figure). */
export const LOGO_HOURS = 2;

/** A crew as the placement needs it. */
export interface GameDayCrew {
  id: number;
  hoursPerDay: number;
  workDays: readonly Weekday[];
}

export interface GameDayPlacementInput {
  /** The event's date (department local date). */
  eventOn: string;
  /** First day work can go on (the department's today). */
  notBefore: string;
  /** Steps in working order with their hours. */
  steps: ReadonlyArray<{ step: GameDayStep; hours: number }>;
  crews: readonly GameDayCrew[];
  /** Hours already planned on each crew-day, key `${crewId}|${date}`. */
  load: ReadonlyMap<string, number>;
  /** The crew that works the site, preferred when it has room. */
  siteCrewId: number | null;
  /** How many days before the event the work may start at the earliest (default 7). */
  lookBackDays?: number;
}

export interface PlacedStep {
  step: GameDayStep;
  hours: number;
  date: string;
  crewId: number | null;
  /** No crew had room on any day before it: placed over the crew's hours on its last day. */
  overHours: boolean;
  /** No working day was left before the event: the step falls on the event day itself. */
  onEventDay: boolean;
}

/**
 * Days and crews for the steps of a game-day preparation. Each step goes on the latest
 * working day before the event that a crew has room for (the day before is best: the cut
 * and the paint are freshest), never after the step that follows it, never before
 * `notBefore`, at most `lookBackDays` back; the site's crew first, else the crew with the
 * most room. Steps are placed from the last to the first, so the order of the work holds
 * (mow ≤ colourant ≤ lines ≤ logo ≤ check). A step no crew has room for goes on the latest
 * possible day with the site's crew (or the first crew) over its hours, flagged; with no
 * working day left it falls on the event day, flagged. Deterministic.
 */
export function placeGameDaySteps(input: GameDayPlacementInput): PlacedStep[] {
  const { eventOn, notBefore, crews } = input;
  if (isoToDayNumber(eventOn) < isoToDayNumber(notBefore)) fail('event_past', `the event on ${eventOn} is before ${notBefore}`);
  const lookBack = input.lookBackDays ?? 7;
  const load = new Map(input.load);
  const sorted = [...crews].filter((c) => c.workDays.length > 0).sort((a, b) => Number(b.id === input.siteCrewId) - Number(a.id === input.siteCrewId) || a.id - b.id);
  const works = (c: GameDayCrew, d: string) => c.workDays.includes(weekdayOf(d) as Weekday);
  // Candidate days: from the day before the event back, none before notBefore.
  const days: string[] = [];
  for (let k = 1; k <= lookBack; k++) {
    const d = addDaysIso(eventOn, -k);
    if (d < notBefore) break;
    days.push(d);
  }
  const out: PlacedStep[] = [];
  let bound: string | null = null;
  for (const s of [...input.steps].reverse()) {
    const allowed = days.filter((d) => bound === null || d <= bound);
    let placed: PlacedStep | null = null;
    for (const d of allowed) {
      let best: { id: number; share: number } | null = null;
      for (const c of sorted) {
        if (!works(c, d)) continue;
        const after = (load.get(`${c.id}|${d}`) ?? 0) + s.hours;
        if (after > c.hoursPerDay + 1e-9) continue;
        const share = after / c.hoursPerDay;
        // The site's crew keeps the work whenever it has room; another crew by most room.
        if (!best || (c.id === input.siteCrewId && best.id !== input.siteCrewId) || (best.id !== input.siteCrewId && share < best.share - 1e-9)) best = { id: c.id, share };
      }
      if (best) {
        placed = { step: s.step, hours: s.hours, date: d, crewId: best.id, overHours: false, onEventDay: false };
        break;
      }
    }
    if (!placed) {
      const worked = allowed.find((d) => sorted.some((c) => works(c, d)));
      if (worked) {
        const crew = sorted.find((c) => works(c, worked))!;
        placed = { step: s.step, hours: s.hours, date: worked, crewId: crew.id, overHours: true, onEventDay: false };
      } else if (sorted.length === 0 && allowed[0]) {
        // No crew yet: the day before stands, for the foreman to assign.
        placed = { step: s.step, hours: s.hours, date: allowed[0], crewId: null, overHours: false, onEventDay: false };
      } else {
        const crew = sorted.find((c) => works(c, eventOn)) ?? null;
        const d: string = bound ?? eventOn;
        placed = { step: s.step, hours: s.hours, date: d < eventOn ? d : eventOn, crewId: crew?.id ?? null, overHours: false, onEventDay: d >= eventOn };
      }
    }
    if (placed.crewId !== null) load.set(`${placed.crewId}|${placed.date}`, (load.get(`${placed.crewId}|${placed.date}`) ?? 0) + s.hours);
    bound = placed.date;
    out.push(placed);
  }
  return out.reverse();
}

/** The share of steps done, 0–1, for the partner's progress bar. */
export function gameDayProgress(statuses: readonly string[]): { done: number; total: number } {
  return { done: statuses.filter((s) => s === 'done').length, total: statuses.length };
}
