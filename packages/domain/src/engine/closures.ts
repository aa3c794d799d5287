/**
 * Closures: when a field check suggests closing or restricting a field, and the day planned
 * work moves to when a closed field's work is put off. The decision to close stays with the
 * foreman and the local rules of play and of the sport's governing body.
 */
import type { ClosureReason, HardnessDevice } from '../vocabulary.ts';
import { HARDNESS_DEVICE_LABELS } from '../vocabulary.ts';
import { CAUTIONS } from './cautions.ts';
import { addDaysIso, weekdayOf, type Weekday } from './dates.ts';
import type { HardnessRange } from './standards.ts';

/** How far under its level's target score a check is "low" (the compliance rule's non-compliant margin, department rule). */
export const LOW_SCORE_MARGIN = 10;

/** What of a stored field check the suggestion reads. */
export interface ClosureCheckInput {
  checkedOn: string;
  /** Surface score 0–100 as stored with the check. */
  score: number;
  /** Gmax reading, or null when none was taken. */
  gmax: number | null;
  gmaxDevice: HardnessDevice | null;
}

export interface ClosureSuggestion {
  status: 'closed' | 'restricted';
  reason: ClosureReason;
  /** Why, in words, with the check's date and figures. */
  why: string;
  checkedOn: string;
  /** The usual caution to show beside it. */
  caution: string;
}

/**
 * A closure the latest field check suggests, or null. Hardness above the tester's limit
 * (`range.max`, Gmax) suggests closing (the caution of `surfaceScore`); below its minimum (a soft,
 * wet surface) restricting with reason `wet`; a surface score more than `LOW_SCORE_MARGIN`
 * points under the level's target restricting for renovation (department rule). Readings are
 * judged only against the range of the tester that took them (ASTM F1936 / F355 missile A: limit
 * 200 Gmax, from memory; the 2.25 kg tester's range is a department setting).
 */
export function closureSuggestion(check: ClosureCheckInput | null, ranges: Record<HardnessDevice, HardnessRange>, targetScore: number): ClosureSuggestion | null {
  if (!check) return null;
  const on = check.checkedOn;
  if (check.gmax !== null && check.gmaxDevice !== null) {
    const range = ranges[check.gmaxDevice];
    const tester = HARDNESS_DEVICE_LABELS[check.gmaxDevice];
    if (range && check.gmax > range.max) {
      return { status: 'closed', reason: 'hardness', checkedOn: on, caution: CAUTIONS.hardness, why: `The check of ${on} read ${check.gmax} Gmax on the ${tester}, above its limit of ${range.max}.` };
    }
    if (range && range.min !== null && check.gmax < range.min) {
      return { status: 'restricted', reason: 'wet', checkedOn: on, caution: CAUTIONS.wetField, why: `The check of ${on} read ${check.gmax} Gmax on the ${tester}, under its minimum of ${range.min}: the surface is soft or wet.` };
    }
  }
  if (check.score < targetScore - LOW_SCORE_MARGIN) {
    return {
      status: 'restricted',
      reason: 'renovation',
      checkedOn: on,
      caution: 'A worn surface recovers faster with less play; resting or renovating it is the foreman’s decision under local rules.',
      why: `The check of ${on} scored ${Math.round(check.score)}, more than ${LOW_SCORE_MARGIN} points under the level’s target of ${targetScore}.`,
    };
  }
  return null;
}

/**
 * The first of the crew's working days on or after `from` (YYYY-MM-DD); Monday to Friday
 * when the crew works no day or there is no crew. Searches at most two weeks.
 */
export function nextWorkingDay(from: string, workDays: readonly Weekday[]): string {
  const days = workDays.length ? workDays : (['mon', 'tue', 'wed', 'thu', 'fri'] as const);
  for (let i = 0; i < 14; i++) {
    const d = addDaysIso(from, i);
    if (days.includes(weekdayOf(d))) return d;
  }
  return from;
}

/** The cautions a closure of this reason shows (lightning, hardness, wet play); none for the others. */
export function closureCaution(reason: ClosureReason): string | null {
  switch (reason) {
    case 'lightning':
      return CAUTIONS.lightning;
    case 'hardness':
      return CAUTIONS.hardness;
    case 'wet':
      return CAUTIONS.wetField;
    default:
      return null;
  }
}
