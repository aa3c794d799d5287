/** Closures of fields, their history, and the public status board. */
import type { ClosureSuggestion } from '../engine/closures.ts';
import type { ClosureReason, ClosureStatus, ClosureWorkChoice, FieldStatus, Sport, WorkStatus, WorkTask } from '../vocabulary.ts';
import type { Instant } from './common.ts';

/** One decision about a field: closed, restricted, or reopened (`status: 'open'`). */
export interface FieldClosureRow<At extends Instant = string> {
  id: number;
  fieldId: number;
  siteId: number;
  districtId: number;
  status: ClosureStatus;
  /** Null for a reopening. */
  reason: ClosureReason | null;
  note: string;
  /** In force from this instant… */
  fromAt: At;
  /** …until the next decision about the field (null while it is in force). */
  toAt: At | null;
  /** The day the field is expected to reopen, YYYY-MM-DD, when known. */
  expectedReopenOn: string | null;
  decidedBy: number | null;
  decidedByName: string | null;
  /** What closing did with the field's planned work, when there was some. */
  workChoice: ClosureWorkChoice | null;
  workCount: number;
}

/** A work order closing the field would touch. */
export interface ClosureWorkLine {
  id: number;
  task: WorkTask;
  plannedDate: string;
  status: WorkStatus;
  crewName: string | null;
}

/** `GET /api/fields/:id/closures`. */
export interface FieldClosures<At extends Instant = string> {
  fieldId: number;
  status: FieldStatus;
  /** The field's version, which a close or reopen must send. */
  version: number;
  /** The decision in force (null when the field was never closed). */
  current: FieldClosureRow<At> | null;
  /** Newest first. */
  history: FieldClosureRow<At>[];
  /** Planned or assigned work from today on: what closing would ask about (before the expected reopening). */
  plannedWork: ClosureWorkLine[];
  /** What the latest field check suggests, when the field is open. */
  suggestion: ClosureSuggestion | null;
}

/** `POST /api/fields/:id/closures` and `/reopen`. */
export interface FieldClosureAnswer<At extends Instant = string> {
  closure: FieldClosureRow<At>;
  fieldVersion: number;
  /** Orders kept, moved (with their new day) and cancelled. */
  work: { kept: number[]; moved: { id: number; from: string; to: string }[]; cancelled: number[] };
}

/** A field on the public status board: nothing but what a player or parent needs. */
export interface StatusBoardField {
  name: string;
  sport: Sport;
  status: ClosureStatus;
  /** The reason in plain words; null when open. */
  reason: string | null;
  /** The last change of status (ISO instant), null when none is on record. */
  since: string | null;
  expectedReopenOn: string | null;
}

export interface StatusBoardSite {
  name: string;
  address: string;
  fields: StatusBoardField[];
}

export interface StatusBoardDistrict {
  name: string;
  sites: StatusBoardSite[];
}

/** `GET /api/public/status`: every kept field of the department, by district and site. */
export interface StatusBoard {
  /** When the answer was built. */
  at: string;
  counts: Record<ClosureStatus, number>;
  districts: StatusBoardDistrict[];
}
