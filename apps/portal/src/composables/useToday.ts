/**
 * The department's "today" and current week for a page: local dates in the department's time
 * zone (from the session), never the browser's zone nor the UTC date. A crew lead's phone set
 * to another zone, or a foreman at 19:00 in an American city, still sees the department's day.
 */
import { addDaysIso, localToday, mondayOf } from '@swardwise/domain';
import { computed } from 'vue';
import { useSessionStore } from '../stores/session.ts';

/**
 * `today` is taken when first read and again whenever the time zone changes; a page left open
 * past midnight keeps its day until it is opened again. `now` is for tests.
 */
export function useToday(now: () => Date = () => new Date()) {
  const session = useSessionStore();
  const timeZone = computed(() => session.timeZone);
  const today = computed(() => localToday(timeZone.value, now()));
  const weekStart = computed(() => mondayOf(today.value));
  const weekDays = computed(() => Array.from({ length: 7 }, (_, i) => addDaysIso(weekStart.value, i)));
  return { timeZone, today, weekStart, weekDays };
}
