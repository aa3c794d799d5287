/**
 * When a field's recurring work falls due by its level's Standards: the next field check and
 * the latest day for the next mowing. Every page that shows a "due" or "overdue" date of a
 * field (fields list, district landing, map, field page) takes it from here, so one field
 * never shows two dates for the same thing.
 */
import { addDaysIso, isoToDayNumber } from './dates.ts';
import { requirePositive } from './check.ts';
import { levelIntervalDays, mowTriggerHeightMm, mowingPolicy, type LevelMowingRule } from './mowing.ts';

export type DueState = 'never' | 'ok' | 'due' | 'overdue';

export interface Due {
  /** Day it falls due (last + the level's interval); null when nothing is on record. */
  dueOn: string | null;
  /** never: nothing on record; overdue: `today` is past `dueOn`; due: `dueOn` is today; else ok. */
  state: DueState;
  /** Whole days past `dueOn` (0 unless overdue). */
  daysOverdue: number;
}

function dueFrom(last: string | null, intervalDays: number, today: string): Due {
  if (last === null) return { dueOn: null, state: 'never', daysOverdue: 0 };
  const dueOn = addDaysIso(last, intervalDays);
  const late = isoToDayNumber(today) - isoToDayNumber(dueOn);
  return { dueOn, state: late > 0 ? 'overdue' : late === 0 ? 'due' : 'ok', daysOverdue: Math.max(0, late) };
}

/**
 * The next field check: due `fieldCheckDays` (the level's Standards) after the last one, and
 * overdue from the day after. `today` is the department's local date (YYYY-MM-DD).
 */
export function fieldCheckDue(lastCheckedOn: string | null, fieldCheckDays: number, today: string): Due {
  requirePositive(fieldCheckDays, 'invalid_interval', 'days between field checks');
  return dueFrom(lastCheckedOn, fieldCheckDays, today);
}

/** The next mowing of a field, from its last mowing and the growth since. */
export interface MowingDue extends Due {
  /** Why it falls due: the one-third rule, the level's interval, or (null) not within the growth given. */
  reason: 'growth' | 'frequency' | null;
  /** The level's interval has passed but the grass has not grown a tenth of HOC: no cut is asked until it grows. */
  waitingForGrowth: boolean;
}

/**
 * The next mowing by the engine's one mowing policy (`mowingPolicy`): due on the first day
 * the grass would pass 1.5 × HOC (one-third rule, common practice), or once the level's
 * interval (`levelIntervalDays`) has passed and the grass has grown a tenth of HOC
 * (department rule: the frequency does not send mowers onto dormant turf), whichever comes
 * first. `growthAfterMm[i]` is the growth (mm) of day lastMowedOn + 1 + i, grown from HOC
 * after the cut; days beyond it are unknown. `today` is the department's local date.
 */
export function mowingDue(lastMowedOn: string | null, hocMm: number, rule: LevelMowingRule, growthAfterMm: ArrayLike<number>, today: string): MowingDue {
  if (lastMowedOn === null) return { dueOn: null, state: 'never', daysOverdue: 0, reason: null, waitingForGrowth: false };
  const policy = mowingPolicy(hocMm, rule);
  const interval = levelIntervalDays(rule);
  const allowance = mowTriggerHeightMm(hocMm) - hocMm;
  let grown = 0;
  for (let i = 0; i < growthAfterMm.length; i++) {
    grown += growthAfterMm[i] as number;
    const day = i + 1;
    const reason = grown > allowance + 1e-9 ? 'growth' : day >= interval && grown >= policy.frequencyMinGrowthMm ? 'frequency' : null;
    if (reason) return { ...dueFrom(lastMowedOn, day, today), reason, waitingForGrowth: false };
  }
  const todayIndex = isoToDayNumber(today) - isoToDayNumber(lastMowedOn);
  return { dueOn: null, state: 'ok', daysOverdue: 0, reason: null, waitingForGrowth: growthAfterMm.length >= interval && todayIndex >= interval };
}

/**
 * The latest day of the next mowing by the level alone: the last mowing plus the level's
 * interval (`levelIntervalDays`: its longest interval or ⌊7 ÷ least mowings per week⌋ days,
 * whichever is shorter). Growth can make a cut due earlier (one-third rule), never later.
 */
export function mowingDueBy(lastMowedOn: string | null, rule: LevelMowingRule, today: string): Due {
  return dueFrom(lastMowedOn, levelIntervalDays(rule), today);
}
