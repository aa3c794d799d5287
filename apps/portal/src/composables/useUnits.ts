import { computed } from 'vue';
import { useSessionStore } from '../stores/session.ts';
import { formatHoc, formatLandArea, formatSurfaceArea } from '../utils/units.ts';

/** Formatters bound to the signed-in user's unit preference. */
export function useUnits() {
  const session = useSessionStore();
  const units = computed(() => session.units);
  return {
    units,
    landArea: (m2: number) => formatLandArea(m2, units.value),
    surfaceArea: (m2: number) => formatSurfaceArea(m2, units.value),
    hoc: (mm: number) => formatHoc(mm, units.value),
  };
}
