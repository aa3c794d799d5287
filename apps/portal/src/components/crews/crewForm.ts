import type { Weekday } from '@swardwise/domain';

/** The working week as a foreman reads it: Monday first. */
export const WEEK_ORDER: Weekday[] = ['mon', 'tue', 'wed', 'thu', 'fri', 'sat', 'sun'];
export const WEEKDAY_SHORT: Record<Weekday, string> = { mon: 'Mon', tue: 'Tue', wed: 'Wed', thu: 'Thu', fri: 'Fri', sat: 'Sat', sun: 'Sun' };

/** Working days in week order, as short names ("Mon–Fri" for a run of three or more). */
export function workDaysText(days: readonly Weekday[]): string {
  const sorted = WEEK_ORDER.filter((d) => days.includes(d));
  if (!sorted.length) return '—';
  const runs: Weekday[][] = [];
  for (const d of sorted) {
    const last = runs.at(-1);
    if (last && WEEK_ORDER.indexOf(d) === WEEK_ORDER.indexOf(last.at(-1)!) + 1) last.push(d);
    else runs.push([d]);
  }
  return runs.map((r) => (r.length >= 3 ? `${WEEKDAY_SHORT[r[0]!]}–${WEEKDAY_SHORT[r.at(-1)!]}` : r.map((d) => WEEKDAY_SHORT[d]).join(', '))).join(', ');
}
