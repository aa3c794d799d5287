/**
 * Writes a department date (`YYYY-MM-DD`, already the department's local date) in words. The
 * date is read as noon UTC and written in UTC, so the browser's own time zone never moves it
 * to the day before or after.
 */
export function formatDay(iso: string, options: Omit<Intl.DateTimeFormatOptions, 'timeZone'>): string {
  return new Date(`${iso}T12:00:00Z`).toLocaleDateString('en-US', { ...options, timeZone: 'UTC' });
}

/** "Sep 7" */
export const DAY_MONTH = { month: 'short', day: 'numeric' } as const;
/** "Sep 7, 2026" */
export const DAY_MONTH_YEAR = { month: 'short', day: 'numeric', year: 'numeric' } as const;
/** "Mon, Sep 7" */
export const WEEKDAY_DAY = { weekday: 'short', month: 'short', day: 'numeric' } as const;
/** "Mon, Sep 7, 2026" */
export const WEEKDAY_DAY_YEAR = { weekday: 'short', month: 'short', day: 'numeric', year: 'numeric' } as const;
