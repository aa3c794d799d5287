/** Field checks as the field page and Today read them. */
import type { FieldCheckFlag, WearArea } from '../engine/field-check.ts';
import type { HardnessDevice } from '../vocabulary.ts';
import type { CalibrationConfidence } from '../engine/growth-calibration.ts';
import type { Instant } from './common.ts';
import type { WorkPhoto } from './work-orders.ts';

/** One field check with its score and flags. */
export interface FieldCheckRow<At extends Instant = string> {
  id: number;
  fieldId: number;
  checkedOn: string;
  checkedBy: number | null;
  checkedByName: string | null;
  turfCoverPct: number;
  weedsPct: number;
  barePct: number;
  bareAreas: WearArea[];
  heightMm: number | null;
  /** Mean of the readings (G). */
  gmax: number | null;
  gmaxDevice: HardnessDevice | null;
  hardnessReadings: number[];
  evenness: number | null;
  divots: number | null;
  tornLeafTips: boolean;
  notes: string;
  score: number;
  flags: FieldCheckFlag[];
  /** The work order it was logged on (its photos are that order's). */
  workOrderId: number | null;
  /** Days from the last mowing on record to the check (null when none was on record). */
  daysSinceCut: number | null;
  /** Its photos: the work order's when logged on one, else the check's own. */
  photos: WorkPhoto<At>[];
  createdAt: At;
}

/** `POST /api/work-orders/:id/field-check`: the stored check, what the engine made of it and the order, now done. */
export interface FieldCheckAnswer<At extends Instant = string> {
  check: FieldCheckRow<At>;
  advice: string[];
  cautions: string[];
  coverTargetPct: number;
  hocMm: number;
}

/** `GET /api/fields/:id/checks`: the field's latest checks, newest first. */
export interface FieldCheckList<At extends Instant = string> {
  items: FieldCheckRow<At>[];
  /** The surface score the field's maintenance level targets (Standards). */
  targetScore: number;
}

/** `GET /api/fields/:id/growth-calibration`: the field's growth against the engine's prediction. */
export interface FieldGrowthCalibration {
  /** Observed ÷ predicted growth (`growthCalibrationFactor`); 1 without readings. */
  factor: number;
  n: number;
  spread: number | null;
  confidence: CalibrationConfidence;
  /** The grass's default maximum growth, mm/day at GP = 1 (department parameters). */
  defaultRateMmPerDay: number;
  /** Default × factor, mm/day at GP = 1. */
  calibratedRateMmPerDay: number;
  /** HOC the readings were compared with, mm (the field's HOC now). */
  hocMm: number;
  readings: { checkedOn: string; daysSinceCut: number; measuredHeightMm: number; observedMm: number; predictedMm: number; ratio: number }[];
  skipped: { checkedOn: string; reason: string }[];
  /** Whether the mowing prediction uses the calibrated rate (it does not yet: shown only). */
  usedForMowing: boolean;
  /** The station the predicted growth came from. */
  stationName: string | null;
}
