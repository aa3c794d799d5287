/** `GET /api/map` and `GET /api/map/basemap`. */
import type { FeatureCollection } from 'geojson';
import type { DueState } from '../engine/due.ts';
import type { Polygon } from '../schemas/common.ts';
import type { FieldStatus, Grass, Level, SiteKind, Sport } from '../vocabulary.ts';

export interface MapDistrict {
  id: number;
  name: string;
  boundary: Polygon;
}

export interface MapSite {
  id: number;
  name: string;
  kind: SiteKind;
  districtId: number;
  lat: number;
  lng: number;
}

/** A field on the map, with the value of every map theme. */
export interface MapField {
  id: number;
  siteId: number;
  districtId: number;
  name: string;
  sport: Sport;
  grass: Grass;
  maintenanceLevel: Level;
  status: FieldStatus;
  /** m². */
  areaM2: number;
  longAxisDeg: number | null;
  /** Long axis closer to east–west than north–south (low sun in players' eyes at one end). */
  eastWest: boolean;
  /** Latest surface score (0–100) and the day of that field check; null without checks. */
  score: number | null;
  scoredOn: string | null;
  lastMowedOn: string | null;
  /** Whole days from the last mowing to `asOf`; null when never mowed. */
  daysSinceMowing: number | null;
  hocMm: number;
  /** Grass height the engine predicts at the end of `asOf`, mm; null without a last mowing or weather. */
  predictedHeightMm: number | null;
  /** Predicted height above 1.5 × HOC (one-third rule); null when it cannot be computed. */
  overdue: boolean | null;
  /** Day the predicted height first passed 1.5 × HOC. */
  overdueSince: string | null;
  /** Next field check by the level's Standards (`fieldCheckDue`) as of the day asked for; null without a check on record. */
  checkDueOn: string | null;
  checkState: DueState;
  /** Day the next mowing falls due by the engine's mowing policy (`mowingDue`) over the growth since the last mowing; null when never mowed or not due by `asOf`. */
  mowDueOn: string | null;
  mowDueState: DueState;
  /** The level's interval has passed but the grass has not grown enough to ask a cut. */
  mowWaitingForGrowth: boolean;
  version: number;
  geometry: Polygon;
}

/** `GET /api/map`: everything on the map the caller may see. */
export interface MapAnswer {
  /** The day the values describe: today, or the latest day with weather when today has none. */
  asOf: string;
  /** The day asked for (today unless `asOf` was given). */
  requested: string;
  /** Plain words when `asOf` is not the day asked for, or weather is missing. */
  weatherNote: string | null;
  districts: MapDistrict[];
  sites: MapSite[];
  fields: MapField[];
}

/** `GET /api/map/basemap`: the bundled vector basemap and the configured tile layer, if any. */
export interface BasemapAnswer {
  /** GeoJSON (RFC 7946) streets, water and parks, drawn as they are. */
  basemap: FeatureCollection;
  tileUrl: string | null;
  attribution: string | null;
}
