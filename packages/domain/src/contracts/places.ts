/** Districts, sites and fields: the places the department keeps. */
import type { Polygon } from '../schemas/common.ts';
import type { Clippings, FieldStatus, Grass, IrrigationKind, Level, Rootzone, SiteKind, SiteOwner, Sport } from '../vocabulary.ts';
import type { Instant, Items } from './common.ts';

/** A row of `GET /api/districts`, with what it holds. */
export interface DistrictRow {
  id: number;
  code: string;
  name: string;
  boundary: Polygon;
  /** Where the crews load up each morning (routes start and end there). */
  yard: { name: string; lat: number; lng: number };
  version: number;
  siteCount: number;
  fieldCount: number;
  /** Total area of its fields, m². */
  fieldAreaM2: number;
}

/** A row of `GET /api/sites`, and the site of every site answer. */
export interface SiteRow<At extends Instant = string> {
  id: number;
  districtId: number;
  districtName: string;
  name: string;
  kind: SiteKind;
  owner: SiteOwner;
  address: string;
  lat: number;
  lng: number;
  notes: string;
  fieldCount: number;
  /** Total area of its fields, m². */
  fieldAreaM2: number;
  version: number;
  updatedAt: At;
}

/** `POST /api/sites`, `PATCH /api/sites/:id`. */
export interface SiteAnswer<At extends Instant = string> {
  site: SiteRow<At>;
}

/** `GET /api/sites/:id`: the site with its fields. */
export interface SiteDetailAnswer<At extends Instant = string> extends SiteAnswer<At> {
  fields: FieldRow<At>[];
}

/** A row of `GET /api/fields` (and of a site's fields). */
export interface FieldRow<At extends Instant = string> {
  id: number;
  siteId: number;
  siteName: string;
  districtId: number;
  districtName: string;
  name: string;
  sport: Sport;
  grass: Grass;
  rootzone: Rootzone;
  irrigation: IrrigationKind;
  maintenanceLevel: Level;
  /** The field's own HOC, mm; null follows the Standards. */
  hocOverrideMm: number | null;
  clippings: Clippings;
  status: FieldStatus;
  statusNote: string;
  weeklyUseHours: number;
  /** Geodesic area of the outline, m². */
  areaM2: number;
  /** Bearing of the long axis, 0–180° from north; null for an outline without one. */
  longAxisDeg: number | null;
  /** Day of the last mowing done (from work records). */
  lastMowedOn: string | null;
  /** Crews given work on the field in the last fortnight or from now on (the crew ability reads it). */
  crewIds: number[];
  version: number;
  updatedAt: At;
}

/** A field with its outline: `GET /api/fields/:id` and the field of every write. */
export interface FieldDetail<At extends Instant = string> extends FieldRow<At> {
  geometry: Polygon;
}

/** `GET|PATCH /api/fields/:id`, `POST /api/fields`. */
export interface FieldAnswer<At extends Instant = string> {
  field: FieldDetail<At>;
}

export type DistrictList = Items<DistrictRow>;
export type SiteList<At extends Instant = string> = Items<SiteRow<At>>;
export type FieldList<At extends Instant = string> = Items<FieldRow<At>>;
