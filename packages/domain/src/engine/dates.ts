/**
 * Calendar arithmetic on ISO dates ('YYYY-MM-DD'), in UTC so results never depend on the
 * machine's time zone. No clock is read: callers pass dates in.
 */
import { fail } from './check.ts';

export const WEEKDAYS = ['sun', 'mon', 'tue', 'wed', 'thu', 'fri', 'sat'] as const;
export type Weekday = (typeof WEEKDAYS)[number];

/** Days since 1970-01-01 of a proleptic Gregorian date (H. Hinnant's days_from_civil). */
function daysFromCivil(y: number, m: number, d: number): number {
  const yy = m <= 2 ? y - 1 : y;
  const era = Math.floor(yy / 400);
  const yoe = yy - era * 400;
  const doy = Math.floor((153 * (m + (m > 2 ? -3 : 9)) + 2) / 5) + d - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146097 + doe - 719468;
}

/** Year, month, day of a day number (H. Hinnant's civil_from_days). */
function civilFromDays(z0: number): [number, number, number] {
  const z = z0 + 719468;
  const era = Math.floor(z / 146097);
  const doe = z - era * 146097;
  const yoe = Math.floor((doe - Math.floor(doe / 1460) + Math.floor(doe / 36524) - Math.floor(doe / 146096)) / 365);
  const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100));
  const mp = Math.floor((5 * doy + 2) / 153);
  const d = doy - Math.floor((153 * mp + 2) / 5) + 1;
  const m = mp < 10 ? mp + 3 : mp - 9;
  return [yoe + era * 400 + (m <= 2 ? 1 : 0), m, d];
}

const pad2 = (n: number): string => (n < 10 ? `0${n}` : String(n));

const DAYS_IN_MONTH = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31] as const;
const isLeap = (y: number) => (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;

/** Digit value of the character at `i`, or −100 so that any sum with it goes negative. */
function digitAt(s: string, i: number): number {
  const c = s.charCodeAt(i) - 48;
  return c >= 0 && c <= 9 ? c : -100;
}

function malformedDate(iso: unknown): never {
  return fail('invalid_date', `date must be YYYY-MM-DD (got ${JSON.stringify(iso)})`, { value: iso });
}

/** Days since 1970-01-01 of an ISO date; throws `engine/invalid_date` when malformed. */
export function isoToDayNumber(iso: string): number {
  // Parsed by character codes, without a regular expression or closure: this runs once per
  // day of weather.
  if (typeof iso !== 'string' || iso.length !== 10 || iso.charCodeAt(4) !== 45 || iso.charCodeAt(7) !== 45) malformedDate(iso);
  const y0 = digitAt(iso, 0);
  const y1 = digitAt(iso, 1);
  const y2 = digitAt(iso, 2);
  const y3 = digitAt(iso, 3);
  const m0 = digitAt(iso, 5);
  const m1 = digitAt(iso, 6);
  const d0 = digitAt(iso, 8);
  const d1 = digitAt(iso, 9);
  if (y0 < 0 || y1 < 0 || y2 < 0 || y3 < 0 || m0 < 0 || m1 < 0 || d0 < 0 || d1 < 0) malformedDate(iso);
  const y = y0 * 1000 + y1 * 100 + y2 * 10 + y3;
  const mo = m0 * 10 + m1;
  const day = d0 * 10 + d1;
  const inMonth = mo >= 1 && mo <= 12 ? (mo === 2 && isLeap(y) ? 29 : (DAYS_IN_MONTH[mo - 1] as number)) : 0;
  if (day < 1 || day > inMonth) fail('invalid_date', `${iso} is not a calendar date`, { value: iso });
  return daysFromCivil(y, mo, day);
}

/** ISO date of a day number (days since 1970-01-01). */
export function dayNumberToIso(day: number): string {
  const [y, m, d] = civilFromDays(Math.round(day));
  return `${String(y).padStart(4, '0')}-${pad2(m)}-${pad2(d)}`;
}

/** The ISO date `days` after `iso` (negative goes back). */
export function addDaysIso(iso: string, days: number): string {
  return dayNumberToIso(isoToDayNumber(iso) + days);
}

/** Day of the year, 1 (1 January) to 365/366: FAO-56's J. */
export function dayOfYear(iso: string): number {
  const y = Number(iso.slice(0, 4));
  return isoToDayNumber(iso) - daysFromCivil(y, 1, 1) + 1;
}

/** Weekday of an ISO date ('sun' … 'sat'). */
export function weekdayOf(iso: string): Weekday {
  // 1970-01-01 was a Thursday (index 4).
  const idx = (((isoToDayNumber(iso) + 4) % 7) + 7) % 7;
  return WEEKDAYS[idx] as Weekday;
}

/** The Monday of the week an ISO date falls in (weeks run Monday to Sunday). */
export function mondayOf(iso: string): string {
  return addDaysIso(iso, -((WEEKDAYS.indexOf(weekdayOf(iso)) + 6) % 7));
}

/** Month 1–12 of an ISO date. */
export function monthOf(iso: string): number {
  isoToDayNumber(iso);
  return Number(iso.slice(5, 7));
}

/** The days up to today that have no weather after the last day on file. */
export interface WeatherGap {
  /** The first day without weather (the day after the last on file). */
  since: string;
  /** Today, the department's local date. */
  through: string;
  days: number;
}

/**
 * The weather missing up to `today` after `lastDate`, the station's last day on file
 * (observed or forecast); null when there is none, or when nothing is on file at all.
 */
export function weatherGapUntil(lastDate: string | null, today: string): WeatherGap | null {
  if (!lastDate || lastDate >= today) return null;
  const since = addDaysIso(lastDate, 1);
  return { since, through: today, days: isoToDayNumber(today) - isoToDayNumber(since) + 1 };
}
