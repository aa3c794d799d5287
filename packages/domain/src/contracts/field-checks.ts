/** Field checks as the field page and Today read them. */
import type { FieldCheckFlag, WearArea } from '../engine/field-check.ts';
import type { HardnessDevice } from '../vocabulary.ts';
import type { Instant } from './common.ts';

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
}
