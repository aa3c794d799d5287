/** Bookings of the fields (games, tournaments, practices…). */
import type { FieldEventKind } from '../vocabulary.ts';
import type { Instant, Items, OnField } from './common.ts';

/** A row of `GET /api/field-events` and the event of every write. */
export interface FieldEventRow<At extends Instant = string> extends OnField {
  id: number;
  kind: FieldEventKind;
  title: string;
  /** The day it is played, YYYY-MM-DD. */
  startsOn: string;
  /** Start time HH:MM, or null for "some time that day". */
  startTime: string | null;
  notes: string;
  createdBy: number | null;
  version: number;
  updatedAt: At;
}

/** `POST /api/field-events`, `PATCH /api/field-events/:id`. */
export interface FieldEventAnswer<At extends Instant = string> {
  event: FieldEventRow<At>;
}

export type FieldEventList<At extends Instant = string> = Items<FieldEventRow<At>>;
