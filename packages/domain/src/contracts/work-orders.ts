/** Work orders as the crews and the board read them, and what a crew reports on them. */
import type { FieldStatus, WorkStatus, WorkTask } from '../vocabulary.ts';
import type { Instant, Items, StoredPhoto } from './common.ts';

/**
 * The engine's notes on an order, which vary by task: a mowing's HOC and mower kind, a
 * watering's run time, a feed's product, a line plan's paint, the booking lines are painted for.
 */
export type WorkOrderDetails = {
  hocMm?: number;
  mowerKind?: 'reel' | 'rotary';
  /** Older demo rows name the mower instead of its kind. */
  mower?: string;
  runTimeMin?: number;
  productKg?: number;
  paintL?: number;
  eventTitle?: string;
  eventOn?: string;
  /** Set when a rain-out cancelled the order: the reason the crew sees, and who cancelled it on which day. */
  cancelled?: { reason: string; by: string; on: string };
  /** The mowing pattern asked for (stripes, checkerboard…), when the order carries one. */
  pattern?: string;
  /** A colourant job's product, label rate (mL/m²) and area (m²). */
  colourant?: { product: string; rateMlPerM2: number; areaM2: number };
} & Record<string, unknown>;

/** A work order: a row of `GET /api/work-orders`, of the week board, and the order of every write. */
export interface WorkOrderRow<At extends Instant = string> {
  id: number;
  /** Null for a yard job (blade sharpening): work at the district's yard, on no field. */
  fieldId: number | null;
  /** Empty for a yard job. */
  fieldName: string;
  /** Null for a yard job. */
  siteId: number | null;
  /** The site's name; a yard job: the district's yard. */
  siteName: string;
  /** The site's street address, for the crew's way there. */
  siteAddress: string;
  /** The field's status now (open, restricted, closed): a crew must see a closure before it drives there; a closed field stops the job (a done report is refused). */
  fieldStatus: FieldStatus;
  /** Why the field is restricted or closed, as the foreman wrote it. */
  fieldStatusNote: string;
  siteLat: number;
  siteLng: number;
  districtId: number;
  task: WorkTask;
  /** Monday of the order's week. */
  weekStart: string;
  plannedDate: string;
  crewId: number | null;
  crewName: string | null;
  equipmentId: number | null;
  equipmentName: string | null;
  plannedHours: number;
  actualHours: number | null;
  status: WorkStatus;
  origin: 'generated' | 'manual';
  /** Kept by hand: re-generating the week leaves it where it is. */
  pinned: boolean;
  /** Why the planner asked for it, in plain words. */
  reason: string;
  notes: string;
  details: WorkOrderDetails;
  doneAt: At | null;
  version: number;
  photoCount: number;
  /** Centre of the field's outline (WGS 84), for a `geo:` directions link. */
  fieldLat: number;
  fieldLng: number;
}

/** `POST /api/work-orders`, `PATCH /api/work-orders/:id`: the order and how many crew leads were e-mailed. */
export type WorkOrderWriteAnswer<At extends Instant = string> = WorkOrderRow<At> & { emailed: number };

/** One order as a crew works it, with who finished it. */
export interface WorkOrderDetail<At extends Instant = string> extends WorkOrderRow<At> {
  startedAt: At | null;
  doneBy: number | null;
}

/** A report a crew made on an order. */
export interface WorkUpdate<At extends Instant = string> {
  id: number;
  status: WorkStatus;
  actualHours: number | null;
  note: string;
  /** The phone's clock when the crew reported (kept with its calendar day). */
  reportedAt: At;
}

export interface WorkUpdateRow<At extends Instant = string> extends WorkUpdate<At> {
  createdBy: number | null;
  /** Who sent the report, for the foreman reading it. */
  createdByName: string | null;
  createdAt: At;
}

/** `url`: `GET /api/work-orders/:id/photos/:photoId`. */
export type WorkPhoto<At extends Instant = string> = StoredPhoto<At>;

/** `GET /api/work-orders/:id`: the order with its reports and photos. */
export interface WorkOrderAnswer<At extends Instant = string> {
  order: WorkOrderDetail<At>;
  updates: WorkUpdateRow<At>[];
  photos: WorkPhoto<At>[];
}

/** `POST /api/work-orders/:id/reports` (201; 200 when `clientRef` was sent before and this is that report). */
export interface ReportAnswer<At extends Instant = string> {
  order: WorkOrderDetail<At>;
  update: WorkUpdate<At>;
  duplicate: boolean;
}

/** `POST /api/work-orders/:id/photos` (201; 200 for a photo sent before). */
export interface PhotoAnswer<At extends Instant = string> {
  photo: WorkPhoto<At>;
  duplicate: boolean;
}

export type WorkOrderList<At extends Instant = string> = Items<WorkOrderRow<At>>;

/** One logged job of a field's work history: the order, what the crew reported and its photos. */
export interface WorkHistoryEntry<At extends Instant = string> {
  order: WorkOrderRow<At>;
  updates: WorkUpdateRow<At>[];
  photos: WorkPhoto<At>[];
}

/** `GET /api/fields/:id/work`: the field's logged work, newest first, one page at a time. */
export interface WorkHistoryPage<At extends Instant = string> {
  items: WorkHistoryEntry<At>[];
  page: number;
  pageSize: number;
  total: number;
}

/** `POST /api/work-orders/:id/reopen`: the order back in its open state and the entry that records why. */
export interface ReopenAnswer<At extends Instant = string> {
  order: WorkOrderDetail<At>;
  update: WorkUpdate<At>;
}
