/**
 * The partner's own pages (a school athletic director or league contact): their fields in
 * plain words. These answers carry no costs, no internal notes, no staff names and no ids
 * beyond what the pages link or write with.
 */
import type { ClosureStatus, Sport } from '../vocabulary.ts';
import type { FieldEventRow } from './field-events.ts';
import type { FieldRequestRow } from './requests.ts';

/** Whether the field can be played, in words. */
export interface PartnerFieldStatus {
  status: ClosureStatus;
  /** e.g. "Closed to play". */
  headline: string;
  /** Why, in plain words; null when open. */
  reason: string | null;
  /** The local day the current status began; null when the field was never closed. */
  since: string | null;
  /** The day the field is expected to reopen, YYYY-MM-DD, when known. */
  expectedReopenOn: string | null;
}

/** The next mowing or line painting of a field. */
export interface PartnerNextWork {
  /** YYYY-MM-DD; null when none is planned or due. */
  on: string | null;
  /** planned: on the week plan; due: the latest day by the field's maintenance level. */
  basis: 'planned' | 'due' | null;
}

/** A field on the partner's landing page. */
export interface PartnerFieldSummary {
  id: number;
  name: string;
  sport: Sport;
  status: PartnerFieldStatus;
  /** Latest surface score (0–100) and the day of that field check. */
  score: number | null;
  checkedOn: string | null;
  nextMowing: PartnerNextWork;
  nextLines: PartnerNextWork;
  /** Bookings from today on. */
  comingBookings: number;
}

export interface PartnerSite {
  name: string;
  address: string;
  fields: PartnerFieldSummary[];
}

/** `GET /api/partner/fields`. */
export interface PartnerFieldsAnswer {
  /** The department's local date the answer is for. */
  today: string;
  sites: PartnerSite[];
  /** The usual cautions about play (wet fields, lightning, what the score is for). */
  cautions: string[];
}

/** A photo of the latest field check, served by `GET /api/partner/fields/:id/photos/:photoId`. */
export interface PartnerPhoto {
  url: string;
  width: number;
  height: number;
}

/** The latest field check, in plain words. */
export interface PartnerCheck {
  checkedOn: string;
  score: number;
  /** The score the field's maintenance level aims for. */
  targetScore: number;
  /** What the score means for play, in a sentence. */
  meaning: string;
  photos: PartnerPhoto[];
}

/** A booking in the partner's one list. */
export interface PartnerBookingItem extends Pick<FieldEventRow, 'id' | 'kind' | 'title' | 'startsOn' | 'startTime'> {
  type: 'booking';
  /** The partner's own notes; empty on bookings they did not make. */
  notes: string;
  /** Made by this partner: they may change or cancel it. */
  mine: boolean;
  /** The booking's version, which a change must send (only on the partner's own bookings). */
  version: number | null;
}

/** A request filed for the field, in the partner's one list with its state. */
export interface PartnerRequestItem extends Pick<FieldRequestRow, 'id' | 'kind' | 'gameOn' | 'startTime' | 'layout' | 'description' | 'state' | 'reason'> {
  type: 'request';
  /** The game's day for a game request, else the day it was filed (department's date). */
  startsOn: string;
  /** Filed by this partner: they may change it while it is still requested. */
  mine: boolean;
  /** The request's version, which a change must send (only on the partner's own requests). */
  version: number | null;
}

/**
 * One row of the partner's list of bookings and requests, newest kind of row added as a new
 * member of this union (`type` tells them apart; every row has `startsOn` to sort by).
 */
export type PartnerAgendaItem = PartnerBookingItem | PartnerRequestItem;

/** `GET /api/partner/fields/:id`. */
export interface PartnerFieldAnswer {
  today: string;
  field: {
    id: number;
    name: string;
    sport: Sport;
    siteName: string;
    siteAddress: string;
  };
  status: PartnerFieldStatus;
  check: PartnerCheck | null;
  nextMowing: PartnerNextWork;
  nextLines: PartnerNextWork;
  /** Bookings from today on, and the field's requests (open ones, and those closed in the last weeks), by day. */
  agenda: PartnerAgendaItem[];
  /** The partner may book this field. */
  canBook: boolean;
  cautions: string[];
}
