import { addDaysIso, formatDepth, formatTemperature, type UnitSystem, type WeatherGap } from '@swardwise/domain';
import { DAY_MONTH, formatDay, WEEKDAY_DAY_YEAR } from '../../utils/calendarDate.ts';

const shown = (d: { value: number; unit: string }) => `${d.value.toLocaleString('en-US')} ${d.unit}`;
export const tempText = (c: number, u: UnitSystem) => shown(formatTemperature(c, u));
export const depthText = (mm: number, u: UnitSystem) => shown(formatDepth(mm, u));

const DAY_MS = 86_400_000;
const short = (iso: string) => formatDay(iso, DAY_MONTH);
export const dateText = (iso: string) =>
  formatDay(iso, WEEKDAY_DAY_YEAR);

/** Missing dates folded into runs: "Oct 5, Nov 12–14 (3 days)". */
export function gapRuns(gaps: readonly string[]): { from: string; to: string; days: number; text: string }[] {
  const runs: { from: string; to: string; days: number }[] = [];
  for (const d of [...gaps].sort()) {
    const last = runs.at(-1);
    if (last && Date.parse(d) - Date.parse(last.to) === DAY_MS) {
      last.to = d;
      last.days++;
    } else runs.push({ from: d, to: d, days: 1 });
  }
  return runs.map((r) => ({ ...r, text: r.days === 1 ? short(r.from) : `${short(r.from)}–${short(r.to)} (${r.days} days)` }));
}

/** The weather a station is missing up to today, in words: what is missing, since when, and what the figures rest on. */
export function weatherGapText(gap: WeatherGap, stationName: string): string {
  const days = gap.days === 1 ? 'today has' : `the ${gap.days} days from ${dateText(gap.since)} to today have`;
  return `No weather from ${stationName} since ${dateText(addDaysIso(gap.since, -1))}: ${days} none on file (the weather service may be down, or a station file is due). Figures rest on the last weather on file.`;
}
