import type { Polygon } from '@swardwise/domain';
import type { FeatureCollection } from 'geojson';
import { api } from './client.ts';

/** Shapes of `GET /api/map` and `GET /api/map/basemap`. */

export interface MapDistrict {
  id: number;
  name: string;
  boundary: Polygon;
}

export interface MapSite {
  id: number;
  name: string;
  kind: string;
  districtId: number;
  lat: number;
  lng: number;
}

export interface MapField {
  id: number;
  siteId: number;
  districtId: number;
  name: string;
  sport: string;
  grass: string;
  maintenanceLevel: 1 | 2 | 3 | 4;
  status: 'open' | 'restricted' | 'closed';
  areaM2: number;
  longAxisDeg: number | null;
  eastWest: boolean;
  score: number | null;
  scoredOn: string | null;
  lastMowedOn: string | null;
  daysSinceMowing: number | null;
  hocMm: number;
  predictedHeightMm: number | null;
  overdue: boolean | null;
  overdueSince: string | null;
  version: number;
  geometry: Polygon;
}

export interface MapData {
  asOf: string;
  requested: string;
  weatherNote: string | null;
  districts: MapDistrict[];
  sites: MapSite[];
  fields: MapField[];
}

export interface Basemap {
  basemap: FeatureCollection;
  tileUrl: string | null;
  attribution: string | null;
}

export function getMap(signal?: AbortSignal): Promise<MapData> {
  return api.get<MapData>('/map', undefined, signal);
}

export function getBasemap(signal?: AbortSignal): Promise<Basemap> {
  return api.get<Basemap>('/map/basemap', undefined, signal);
}
