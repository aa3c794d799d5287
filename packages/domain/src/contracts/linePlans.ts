/** A field's line plan as saved, and what its figures are worked out from. */
import type { LineSettings } from '../engine/lines.ts';
import type { PlanLayout, PlanPaint, SeasonShift } from '../engine/linePlans.ts';
import type { Instant } from './common.ts';

/** A line marker of the field's district. */
export interface LineMarkerChoice {
  id: number;
  name: string;
  /** Marking speed, km/h (the department's default when the unit has none). */
  speedKmh: number;
}

/** `GET /api/fields/:id/lines` and the answer of `PUT`. */
export interface FieldLinePlan<At extends Instant = string> {
  fieldId: number;
  layouts: PlanLayout[];
  paint: PlanPaint;
  markerId: number | null;
  /** Season window, MM-DD. */
  seasonStart: string;
  seasonEnd: string;
  /** Shift of the whole plan per season (key: the year). */
  shifts: Record<string, SeasonShift>;
  /** The plan row's version (null while the field has none). */
  version: number | null;
  updatedAt: At | null;
  setByName: string | null;
  /** The department's line-marking settings (coverage, set-up, default marker speed). */
  settings: LineSettings;
  markers: LineMarkerChoice[];
  /** Days between repaints for the field's level (Standards); null: no lines kept. */
  repaintDays: number | null;
  /** The field's events (bookings) in the current season, for the repaint schedule. */
  events: Array<{ date: string; title: string }>;
  /** The department's today, YYYY-MM-DD (the current season is its year). */
  today: string;
}
