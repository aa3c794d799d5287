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

/**
 * Names the markers leaflet-geoman puts on the map while an outline is drawn or edited. Leaflet
 * gives every marker role="button" and a tab stop, and geoman's carry no text: each would be a
 * nameless button (WCAG 4.1.2). A corner is named as one (while drawing, the first one closes
 * the outline), a middle marker adds a corner, and the cursor marker, which only follows the
 * pointer, leaves the tab order and assistive technology. Answers the observer to disconnect.
 */
export function nameOutlineMarkers(pane: HTMLElement): MutationObserver {
  const name = () => {
    let corner = 0;
    for (const marker of pane.querySelectorAll<HTMLElement>('.marker-icon')) {
      if (marker.classList.contains('cursor-marker')) {
        marker.removeAttribute('role');
        marker.tabIndex = -1;
        marker.setAttribute('aria-hidden', 'true');
        continue;
      }
      const label = marker.classList.contains('marker-icon-middle') ? 'Add a corner here' : `Corner ${++corner} of the outline`;
      if (marker.getAttribute('aria-label') !== label) marker.setAttribute('aria-label', label);
    }
  };
  // Markers come and go as children of the pane; naming them changes attributes only.
  const observer = new MutationObserver(name);
  observer.observe(pane, { childList: true });
  name();
  return observer;
}

export { L };
