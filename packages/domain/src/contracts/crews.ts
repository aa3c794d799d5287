/** Crews and their equipment. */
import type { Weekday } from '../engine/dates.ts';
import type { BladeState } from '../engine/blades.ts';
import type { EquipmentKind } from '../vocabulary.ts';
import type { Instant, Items } from './common.ts';

/** A row of `GET /api/crews`. */
export interface CrewRow {
  id: number;
  districtId: number;
  districtName: string;
  name: string;
  hoursPerDay: number;
  members: string[];
  workDays: Weekday[];
  /** The crew lead's account, if the crew has one. */
  leadUserId: number | null;
  leadName: string | null;
  version: number;
}

/**
 * The crew of `POST /api/crews` and `PATCH /api/crews/:id`: the stored row, without the
 * district's and lead's names a list row carries.
 */
export interface StoredCrew<At extends Instant = string> {
  id: number;
  districtId: number;
  name: string;
  hoursPerDay: number;
  members: string[];
  workDays: Weekday[];
  version: number;
  createdAt: At;
  updatedAt: At;
}

/** `POST /api/crews`, `PATCH /api/crews/:id`. */
export interface CrewAnswer<At extends Instant = string> {
  crew: StoredCrew<At>;
}

/** A machine: a row of `GET /api/equipment` and the equipment of every write. */
export interface EquipmentRow<At extends Instant = string> {
  id: number;
  districtId: number;
  districtName: string;
  crewId: number | null;
  crewName: string | null;
  kind: EquipmentKind;
  name: string;
  /** Mowers: cutting width (m), mowing speed (km/h), field efficiency (0–1), HOC range (mm). */
  cuttingWidthM: number | null;
  speedKmh: number | null;
  fieldEfficiency: number | null;
  hocMinMm: number | null;
  hocMaxMm: number | null;
  /** Hour meter reading, h. */
  hourMeterH: number;
  sharpenIntervalH: number | null;
  /** Hour meter reading at the last sharpening, h. */
  lastSharpenedAtH: number | null;
  /** Hours run since the last sharpening; null without an interval. */
  hoursSinceSharpening: number | null;
  sharpeningDue: boolean;
  /** `bladeCare`'s state: due, due soon (this week's open mowings on it reach the interval), ok, no interval. */
  bladeState: BladeState;
  /** Hours of open mowing planned on the machine in the current week, h (0 on a create or change answer). */
  weekMowingH: number;
  notes: string;
  active: boolean;
  version: number;
  updatedAt: At;
}

/** `POST /api/equipment`, `PATCH /api/equipment/:id`. */
export interface EquipmentAnswer<At extends Instant = string> {
  equipment: EquipmentRow<At>;
}

export type CrewList = Items<CrewRow>;
export type EquipmentList<At extends Instant = string> = Items<EquipmentRow<At>>;
