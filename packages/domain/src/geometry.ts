/**
 * Field outline geometry: geodesic area and the bearing of a field's long axis.
 */
import turfArea from '@turf/area';
import type { Polygon } from './schemas/common.ts';

/** Area of a GeoJSON polygon in square metres (geodesic, by @turf/area). */
export function polygonAreaM2(polygon: Polygon): number {
  return turfArea({ type: 'Feature', properties: {}, geometry: polygon as GeoJSON.Polygon });
}
