/** `GET /api/fields/:id/needs`: what the turf engine says a field needs for a week (SI units throughout). */
import type { StripeDirection } from '../engine/labour.ts';
import type { RecordTally } from './records.ts';
import type { MowerWarning } from '../engine/mowing.ts';
import type { Level } from '../vocabulary.ts';
import type { WeatherGap } from '../engine/dates.ts';

/** One input of a needs block: the raw SI value and its unit token, so the portal can convert it. */
export interface NeedInput {
  key: string;
  label: string;
  value: number | string | boolean | null;
  /** SI unit token (mm, m, m2, L, gN/m2, mm/day, h, km/h, d, %) or null for plain values. */
  unit: string | null;
}

/** What every block shows besides its figures: its inputs, how it is worked out, its cautions. */
export interface Explained {
  inputs: NeedInput[];
  how: string;
  cautions: string[];
}

export interface HocNeed extends Explained {
  hocMm: number;
  source: 'override' | 'standards_grass' | 'standards_sport';
  /** 1.5 × HOC (one-third rule), mm. */
  triggerHeightMm: number;
  mowerKind: 'reel' | 'rotary';
  mowerWarnings: MowerWarning[];
}

export interface GrowthNeed extends Explained {
  gpDaily: { date: string; gp: number; growthMm: number }[];
  gpMean: number;
  growthMmPerDay: number;
  growthMmWeek: number;
}

export interface MowingNeed extends Explained {
  /** Longest days between cuts by the level's Standards (`levelIntervalDays`), the figure the week plan and the Standards page show. */
  intervalDays: number;
  /** The week plan's mowings of this field in the week asked for (Records' tally); null when the caller may not read work orders. */
  plannedThisWeek: { weekStart: string; asked: number; done: number } | null;
  mowingsThisWeek: number;
  mowingsPerWeek: number;
  weekMowingDates: string[];
  nextMowingOn: string | null;
  nextMowingNote: string | null;
  overdueOn: string | null;
  overdueNow: boolean;
  lastMowedOn: string | null;
}

export interface LabourNeed extends Explained {
  method: 'pass_plan' | 'field_capacity';
  hoursPerMowing: number;
  hoursPerWeek: number;
  seasonHours: number;
  passPlan: { direction: StripeDirection; passes: number; passLengthM: number; turns: number; distanceM: number } | null;
  capacityHours: number;
}

export interface WaterNeed extends Explained {
  irrigated: boolean;
  notIrrigatedReason: string | null;
  et0Method: 'penman_monteith' | 'hargreaves' | 'mixed';
  et0Mm: number;
  kc: number;
  etcMm: number;
  rainMm: number;
  effectiveRainMm: number;
  shareOfEtc: number;
  netMm: number;
  grossMm: number;
  runTimeMin: number;
  volumeL: number;
}

/** One application of the feed plan. */
export interface FeedApplication {
  date: string;
  month: number;
  nGPerM2: number;
  productGPerM2: number;
  productKg: number;
  bags: number;
}

export interface FeedNeed extends Explained {
  annualNGPerM2: number;
  reasons: string[];
  monthlyNGPerM2: number[];
  product: { analysis: string; slowReleaseShare: number; bagKg: number };
  applications: FeedApplication[];
  nextApplication: FeedApplication | null;
  productKgSeason: number;
}

export interface LinesNeed extends Explained {
  kept: boolean;
  reason: string | null;
  template: { id: string; name: string; source: string; lineWidthM: number } | null;
  lineLengthM: number;
  /** What the totals include, element by element. */
  elements: { label: string; count: number; lengthM: number; paintedAreaM2: number; equivalentLengthM: number }[];
  paintedAreaM2: number;
  mixedLitres: number;
  concentrateLitres: number;
  waterLitres: number;
  hoursPerRepaint: number;
  firstCoat: { mixedLitres: number; concentrateLitres: number; waterLitres: number; hours: number };
  repaintDays: number | null;
  repaints: number;
  firstCoats: number;
  touchUps: number;
  seasonMixedLitres: number;
  seasonConcentrateLitres: number;
  seasonHours: number;
}

export interface LevelNeed extends Explained {
  assigned: Level;
  recommended: Level;
  points: number;
  reasons: string[];
  targetScore: number;
  latestCheck: { checkedOn: string; score: number } | null;
  scoreMet: boolean | null;
  /**
   * Work planned against work done on this field over `from`–`to` (the four weeks to the end of
   * the week asked for, by the department's calendar, not the weather's): Records' own tally for
   * the field. `tally` is null when the caller may not read work orders.
   */
  workCompliance: { tracked: boolean; note: string; from: string; to: string; tally: RecordTally | null };
}

/** The daily series of the unbroken run of weather around the week (the season chart). */
export interface SeasonSeries {
  stationId: number;
  start: string;
  end: string;
  dates: string[];
  gp: number[];
  growthMm: number[];
  waterNeedMm: number[];
  mowings: string[];
  feedApplications: { date: string; nGPerM2: number }[];
}

export interface FieldNeeds {
  fieldId: number;
  requestedDate: string;
  /** The week the figures describe; `fallback` when it is not the week asked for (weather missing). */
  week: { start: string; end: string; days: number; fallback: boolean };
  weatherNote: string | null;
  /** Days up to today the station has no weather for; the figures then rest on the last weather on file. */
  weatherGap: WeatherGap | null;
  station: { id: number; code: string; name: string; distanceKm: number; hargreavesDays: number };
  standards: { level: Level; name: string; version: number | null; missingLevels: Level[] };
  hoc: HocNeed;
  growth: GrowthNeed;
  mowing: MowingNeed;
  labour: LabourNeed;
  water: WaterNeed;
  feed: FeedNeed;
  lines: LinesNeed;
  level: LevelNeed;
  season: SeasonSeries;
}

export interface FieldNeedsAnswer {
  needs: FieldNeeds;
}
