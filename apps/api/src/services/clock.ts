/**
 * The department clock of the API: "today", the current week and the local date of an
 * instant, all in the department's time zone. Services read it from their context
 * (`ctx.clock.today()`); nothing else in the API turns an instant into a calendar date.
 *
 * The zone is a department setting (`department.time_zone` in the settings table). Until an
 * administrator sets one, DEPARTMENT_TIME_ZONE applies, else the demo city's zone.
 */
import { performance } from 'node:perf_hooks';
import { eq } from 'drizzle-orm';
import { isTimeZone, localDateOf, localToday, localWeekStart } from '@swardwise/domain';
import type { Queryable } from '../db/client.ts';
import { settings } from '../db/schema/index.ts';

export const TIME_ZONE_KEY = 'department.time_zone';

/** How long this process trusts its copy of the setting before reading it again (another process may have changed it). */
const REFRESH_MS = 60_000;

export interface Clock {
  /** The department's IANA time zone. */
  readonly timeZone: string;
  /** The current instant (fixed in tests). */
  now(): Date;
  /** The department's local date, YYYY-MM-DD. */
  today(): string;
  /** Monday of the department's current week. */
  weekStart(): string;
  /** The department's local date of an instant (a report's time, a job's `doneAt`). */
  dateOf(instant: Date | string | number): string;
}

/** The stored setting: the zone and the version a change must name. */
export interface TimeZoneSetting {
  timeZone: string;
  version: number;
}

/** The stored zone, or null when none is stored; a stored value that is no zone is reported, not used. */
export async function readTimeZoneSetting(db: Queryable): Promise<(TimeZoneSetting & { valid: boolean }) | null> {
  const [row] = await db.select({ value: settings.value }).from(settings).where(eq(settings.key, TIME_ZONE_KEY));
  if (!row) return null;
  const value = row.value as Partial<TimeZoneSetting> | null;
  const timeZone = typeof value?.timeZone === 'string' ? value.timeZone : '';
  return { timeZone, version: Number(value?.version ?? 0) || 0, valid: isTimeZone(timeZone) };
}

export class DepartmentClock implements Clock {
  #zone: string;
  #loadedAt = Number.NEGATIVE_INFINITY;
  #loading: Promise<void> | null = null;

  /**
   * @param fallback the zone used while none is stored (DEPARTMENT_TIME_ZONE or the demo city's)
   * @param now the source of the current instant; tests stand the clock at a chosen moment
   */
  constructor(
    private readonly db: Queryable,
    readonly fallback: string,
    readonly now: () => Date = () => new Date(),
  ) {
    if (!isTimeZone(fallback)) throw new Error(`"${fallback}" is not an IANA time zone (such as America/Chicago)`);
    this.#zone = fallback;
  }

  get timeZone(): string {
    return this.#zone;
  }

  today(): string {
    const { local, now } = this.#thisMinute();
    local.today ??= localToday(this.#zone, now);
    return local.today;
  }

  weekStart(): string {
    const { local, now } = this.#thisMinute();
    local.weekStart ??= localWeekStart(this.#zone, now);
    return local.weekStart;
  }

  /**
   * The local dates of the current minute, worked out once: every request asks for "today"
   * (answer-cache keys, the week board), and a time-zone conversion is dear at hundreds of
   * requests a second. Local midnight falls on a whole minute in every zone in use today
   * (offsets are whole quarter hours), so no minute spans two dates.
   */
  #minute: { zone: string; minute: number; today?: string; weekStart?: string } = { zone: '', minute: Number.NaN };
  #thisMinute(): { local: { today?: string; weekStart?: string }; now: Date } {
    // One reading of the clock, so a date is never worked out from an instant past its minute.
    const now = this.now();
    const minute = Math.floor(now.getTime() / 60_000);
    if (this.#minute.minute !== minute || this.#minute.zone !== this.#zone) this.#minute = { zone: this.#zone, minute };
    return { local: this.#minute, now };
  }

  dateOf(instant: Date | string | number): string {
    return localDateOf(instant, this.#zone);
  }

  /**
   * Reads the stored zone at start-up and again once its copy is a minute old. A stored value
   * that is no zone this runtime knows fails the first load (the server refuses to start);
   * later it keeps the zone in use.
   */
  ready(): Promise<void> {
    if (performance.now() - this.#loadedAt < REFRESH_MS) return Promise.resolve();
    const first = this.#loadedAt === Number.NEGATIVE_INFINITY;
    this.#loading ??= readTimeZoneSetting(this.db)
      .then(
        (stored) => {
          if (stored && !stored.valid) {
            if (first) throw new Error(`The department time zone in the settings table ("${stored.timeZone}") is not an IANA time zone this runtime knows; set it again through /api/settings`);
          } else this.#zone = stored?.timeZone ?? this.fallback;
          this.#loadedAt = performance.now();
        },
        (err: unknown) => {
          // A failed refresh keeps the zone in use; only the first read must succeed.
          if (first) throw err;
          this.#loadedAt = performance.now();
        },
      )
      .finally(() => {
        this.#loading = null;
      });
    return this.#loading;
  }

  /** Takes the zone this process has just stored. */
  use(timeZone: string): void {
    this.#zone = timeZone;
    this.#loadedAt = performance.now();
  }
}
