import type { BasemapAnswer, MapAnswer } from '@swardwise/domain';
import { api } from './client.ts';

export function getMap(signal?: AbortSignal): Promise<MapAnswer> {
  return api.get<MapAnswer>('/map', undefined, signal);
}

export function getBasemap(signal?: AbortSignal): Promise<BasemapAnswer> {
  return api.get<BasemapAnswer>('/map/basemap', undefined, signal);
}
