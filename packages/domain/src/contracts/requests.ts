/** Partners' requests as the API answers them. */
import type { LineLayout } from '../engine/lines.ts';
import type { RequestKind, RequestState, WorkStatus, WorkTask } from '../vocabulary.ts';
import type { Instant, OnField, StoredPhoto } from './common.ts';

/** One request, as lists show it. */
export interface FieldRequestRow<At extends Instant = string> extends OnField {
  id: number;
  kind: RequestKind;
  /** The game's day, YYYY-MM-DD (game requests only). */
  gameOn: string | null;
  startTime: string | null;
  layout: LineLayout | null;
  description: string;
  state: RequestState;
  /** Why it was declined, or the foreman's word on closing or scheduling it. */
  reason: string;
  /** The booking a game request became. */
  eventId: number | null;
  /** The one-off work order any other request became. */
  workOrderId: number | null;
  createdBy: number | null;
  createdByName: string | null;
  photoCount: number;
  messageCount: number;
  version: number;
  createdAt: At;
  updatedAt: At;
}

export interface FieldRequestMessage<At extends Instant = string> {
  id: number;
  authorId: number | null;
  authorName: string | null;
  /** The author's role, so the thread can tell the department from the partner. */
  authorRole: string | null;
  body: string;
  createdAt: At;
}

export type FieldRequestPhoto<At extends Instant = string> = StoredPhoto<At>;

/** Work the request became: the one-off order, or the paintings the week plan made for its booking. */
export interface FieldRequestWork {
  id: number;
  task: WorkTask;
  plannedDate: string;
  status: WorkStatus;
}

/** `GET /api/requests/:id`. */
export interface FieldRequestDetail<At extends Instant = string> {
  request: FieldRequestRow<At>;
  messages: FieldRequestMessage<At>[];
  photos: FieldRequestPhoto<At>[];
  work: FieldRequestWork[];
}

/** `POST /api/requests/:id/photos`. */
export interface FieldRequestPhotoAnswer<At extends Instant = string> {
  photo: FieldRequestPhoto<At>;
}
