/**
 * Invented work history for the demo city: the date each field was last mowed and a few
 * field checks through the season. Deterministic, like the rest of the demo.
 */
import { addDaysIso, DEFAULT_PARAMETERS, surfaceScore } from '@swardwise/domain';
import type { DemoCity } from './demo-city.ts';
import { DEMO_SEASON } from './demo-weather.ts';
import { rngFor } from './prng.ts';

export interface DemoCheck {
  checkedOn: string;
  turfCoverPct: number;
  weedsPct: number;
  barePct: number;
  /** Measured height ÷ HOC at the check. */
  heightRatio: number;
  daysSinceCut: number;
  gmax: number;
  /** The demo crews read hardness with the 2.25 kg portable tester. */
  gmaxDevice: 'portable_2_25kg';
  evenness: number;
  notes: string;
}

/**
 * An invented check as a `field_checks` row, scored by the engine as a real check would be.
 * `scoreHeightMm` is the height the score reads (the season's checks round it first, the
 * history's score the unrounded height); the row keeps the rounded height either way.
 */
export function demoCheckRow(fieldId: number, c: Omit<DemoCheck, 'daysSinceCut'> & { daysSinceCut: number | null }, hocMm: number, scoreHeightMm: number) {
  const scored = surfaceScore(
    { turfCoverPct: c.turfCoverPct, weedsPct: c.weedsPct, bareWornPct: c.barePct, heightMm: scoreHeightMm, hocMm, hardnessG: c.gmax, hardnessDevice: c.gmaxDevice, evenness: c.evenness },
    DEFAULT_PARAMETERS.hardnessRangesG,
  );
  return {
    fieldId,
    checkedOn: c.checkedOn,
    turfCoverPct: c.turfCoverPct,
    weedsPct: c.weedsPct,
    barePct: c.barePct,
    heightMm: Math.round(c.heightRatio * hocMm),
    daysSinceCut: c.daysSinceCut,
    gmax: c.gmax,
    gmaxDevice: c.gmaxDevice,
    evenness: c.evenness,
    notes: c.notes,
    score: Math.round(scored.score * 10) / 10,
    flags: scored.flags,
  };
}

export interface DemoHistory {
  lastMowedOn: string;
  checks: DemoCheck[];
}

/** Days between mowings a crew keeps at each level late in the season (demo choice). */
const LATE_SEASON_INTERVAL = { 1: 3, 2: 5, 3: 8, 4: 14 } as const;
const CHECK_DATES = ['2026-05-12', '2026-08-18', '2026-10-27'];

export function demoFieldHistory(city: DemoCity): DemoHistory[] {
  return city.fields.map((field) => {
    const rand = rngFor(`history:${field.siteKey}:${field.name}`);
    const level = field.maintenanceLevel as 1 | 2 | 3 | 4;
    const interval = LATE_SEASON_INTERVAL[level];
    // Some fields are a few days behind, as on any real crew schedule.
    const daysAgo = Math.floor(rand() * (interval + 4));
    const lastMowedOn = addDaysIso(DEMO_SEASON.end, -daysAgo);
    const quality = (5 - level) / 4; // better-kept levels score higher
    const checks = CHECK_DATES.map((checkedOn, i) => {
      const wear = i === 1 ? 0.08 : 0; // mid-season wear in goalmouths and centres
      const cover = Math.min(100, Math.round(70 + quality * 25 - wear * 100 + rand() * 8));
      const closedHard = field.status === 'closed' && i === CHECK_DATES.length - 1;
      // Cover, weeds and bare/worn share one surface: together at most 100 %.
      const weeds = Math.min(100 - cover, Math.round((1 - quality) * 18 + rand() * 6));
      const bare = Math.min(100 - cover - weeds, Math.round(Math.max(0, 100 - cover - 5 + rand() * 4)));
      return {
        checkedOn,
        turfCoverPct: cover,
        weedsPct: weeds,
        barePct: bare,
        heightRatio: Math.round((1.05 + rand() * 0.4 + (level === 4 ? 0.2 : 0)) * 100) / 100,
        daysSinceCut: Math.round(1 + rand() * interval),
        gmax: Math.round(closedHard ? 112 + rand() * 10 : 45 + rand() * 40),
        gmaxDevice: 'portable_2_25kg' as const,
        evenness: Math.max(1, Math.min(5, Math.round(2 + quality * 2.5 + rand()))),
        notes: closedHard ? 'Surface hard in the centre; closed pending aeration and watering' : '',
      };
    });
    return { lastMowedOn, checks };
  });
}
