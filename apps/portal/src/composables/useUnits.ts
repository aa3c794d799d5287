import { computed } from 'vue';
import { useSessionStore } from '../stores/session.ts';
import { distanceText, formatHoc, reasonText, formatLandArea, formatSurfaceArea } from '../utils/units.ts';

/** Formatters bound to the signed-in user's unit preference. */
export function useUnits() {
  const session = useSessionStore();
  const units = computed(() => session.units);
  return {
    units,
    landArea: (m2: number) => formatLandArea(m2, units.value),
    surfaceArea: (m2: number) => formatSurfaceArea(m2, units.value),
    hoc: (mm: number) => formatHoc(mm, units.value),
    /** A drive distance (km inside): miles or kilometres. */
    distance: (km: number) => distanceText(km, units.value),
    /** A week plan's reason (written in millimetres) in the person's units. */
    reason: (text: string) => reasonText(text, units.value),
  };
}
