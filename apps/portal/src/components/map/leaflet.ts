/**
 * One Leaflet for the map page, shared with vue-leaflet through `window.L`
 * (`:use-global-leaflet="true"`), because leaflet-geoman patches the global `L`: two
 * copies would leave the map without its editing tools.
 */
import L from 'leaflet';
import 'leaflet/dist/leaflet.css';
import type {} from '@geoman-io/leaflet-geoman-free';

(window as unknown as { L: typeof L }).L = L;

let geoman: Promise<void> | null = null;

/** Loads leaflet-geoman once, after `window.L` is set (its bundle reads the global). */
export function loadGeoman(): Promise<void> {
  geoman ??= Promise.all([import('@geoman-io/leaflet-geoman-free'), import('@geoman-io/leaflet-geoman-free/dist/leaflet-geoman.css')]).then(() => undefined);
  return geoman;
}

export { L };
