/** The partner pages' dates and coming work in plain words. */
import type { PartnerNextWork } from '@swardwise/domain';
import { addDaysIso } from '@swardwise/domain';
import { formatDay, WEEKDAY_DAY, WEEKDAY_DAY_YEAR } from '../../utils/calendarDate.ts';

/** "Today", "Tomorrow" or "Sat, Dec 5" for a local date (YYYY-MM-DD); `today` is the department's. */
export function dayText(iso: string, today: string): string {
  if (iso === today) return 'Today';
  if (iso === addDaysIso(today, 1)) return 'Tomorrow';
  const sameYear = iso.slice(0, 4) === today.slice(0, 4);
  return formatDay(iso, sameYear ? WEEKDAY_DAY : WEEKDAY_DAY_YEAR);
}

/** The next mowing or line painting: planned on the week plan, or the latest day the field's level allows. */
export function nextWorkText(next: PartnerNextWork, today: string): string {
  if (!next.on) return 'Nothing planned yet';
  if (next.basis !== 'due') return dayText(next.on, today);
  return next.on <= today ? 'Due today' : `By ${dayText(next.on, today)} at the latest`;
}
