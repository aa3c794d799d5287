/** Game-day preparations as the foreman, the crews and the partner read them. */
import type { GameDayStep } from '../engine/game-day.ts';
import type { FieldEventKind, StripePattern, WorkStatus } from '../vocabulary.ts';
import type { Instant, OnField } from './common.ts';

/** One step of the checklist and the work order it became. */
export interface GameDayStepRow {
  step: GameDayStep;
  /** The staff's words ("Paint the lines"). */
  label: string;
  /** The partner's words ("The lines are painted"). */
  publicLabel: string;
  /** Null for a partner, and when the order was deleted. */
  workOrderId: number | null;
  plannedDate: string | null;
  /** The order's status; `planned` when its order is gone. */
  status: WorkStatus;
  done: boolean;
  /** Staff only (null for a partner). */
  crewName: string | null;
  plannedHours: number | null;
  doneAt: Instant | null;
}

/** `GET /api/game-days` item, `POST /api/game-days/events/:eventId` answer. */
export interface GameDayPrepRow<At extends Instant = string> extends OnField {
  id: number;
  eventId: number;
  eventTitle: string;
  eventKind: FieldEventKind;
  eventOn: string;
  eventTime: string | null;
  pattern: StripePattern | null;
  colourant: { product: string; rateMlPerM2: number; areaM2: number } | null;
  steps: GameDayStepRow[];
  progress: { done: number; total: number };
  /** Things the foreman should know about the placement (no day left, over a crew's hours). */
  notes: string[];
  version: number;
  createdAt: At;
}
