/**
 * The department clock. A parks department works by its own calendar: "today", the week a
 * plan belongs to and the day a job was done are local dates in the department's time zone
 * (an IANA name such as `America/Chicago`), never the UTC date of the instant. An American
 * department at 19:00 is still on today's date while UTC has moved on to tomorrow.
 *
 * Pure: the instant is always passed in (`now`), so tests can stand at 23:30 local time or on a
 * daylight-saving change. Time-zone rules come from the runtime's ICU data through @date-fns/tz.
 */
import { TZDate } from '@date-fns/tz';
import { format } from 'date-fns';
import { addDaysIso, mondayOf } from './engine/dates.ts';

/** The time zone used when a department has not set one (the invented demo city's). */
export const DEFAULT_TIME_ZONE = 'America/Chicago';

/** True when `name` is an IANA time-zone name this runtime knows. */
export function isTimeZone(name: string): boolean {
  if (!name || name.length > 64) return false;
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: name });
    return true;
  } catch {
    return false;
  }
}

/** The local calendar date (YYYY-MM-DD) of `instant` in `timeZone`. */
export function localDateOf(instant: Date | string | number, timeZone: string): string {
  const at = instant instanceof Date ? instant : new Date(instant);
  if (Number.isNaN(at.getTime())) throw new RangeError(`not an instant: ${String(instant)}`);
  return format(new TZDate(at.getTime(), timeZone), 'yyyy-MM-dd');
}

/** The department's "today": the local date of `now` in `timeZone`. */
export function localToday(timeZone: string, now: Date = new Date()): string {
  return localDateOf(now, timeZone);
}

/** Monday of the department's current week (weeks run Monday to Sunday). */
export function localWeekStart(timeZone: string, now: Date = new Date()): string {
  return mondayOf(localToday(timeZone, now));
}

/** The seven local dates of the department's current week, Monday first. */
export function localWeekDays(timeZone: string, now: Date = new Date()): string[] {
  const monday = localWeekStart(timeZone, now);
  return Array.from({ length: 7 }, (_, i) => addDaysIso(monday, i));
}

/** The local wall-clock time (HH:mm) of `instant` in `timeZone`, for messages and sheets. */
export function localTimeOf(instant: Date | string | number, timeZone: string): string {
  const at = instant instanceof Date ? instant : new Date(instant);
  return format(new TZDate(at.getTime(), timeZone), 'HH:mm');
}
