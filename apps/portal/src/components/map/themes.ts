/**
 * Map themes: which legend entry a field falls in and how its polygon is drawn. Colours
 * are design-token names (styles/tokens.css); the map resolves them to values once.
 */
import { FIELD_STATUS_LABELS, LEVEL_NAMES, LEVELS, type FieldStatus } from '@swardwise/domain';

export const MAP_THEMES = [
  { key: 'level', label: 'Maintenance level' },
  { key: 'score', label: 'Surface score' },
  { key: 'mowing', label: 'Mowing' },
  { key: 'status', label: 'Status' },
] as const;
export type MapTheme = (typeof MAP_THEMES)[number]['key'];

export function isMapTheme(value: unknown): value is MapTheme {
  return MAP_THEMES.some((t) => t.key === value);
}

/** What a theme needs of a field. */
export interface ThemedField {
  maintenanceLevel: number;
  status: FieldStatus;
  score: number | null;
  daysSinceMowing: number | null;
  overdue: boolean | null;
}

export interface LegendEntry {
  key: string;
  label: string;
  /** Design token of the fill, e.g. `--sw-level-1`. */
  token: string;
  /** Drawn with a dashed outline as well as its colour. */
  dashed?: boolean;
}

/** Score bands (0–100) from the highest; bounds are inclusive lower limits. */
const SCORE_BANDS = [
  { key: 'high', min: 80, label: '80–100', token: '--sw-map-score-high' },
  { key: 'good', min: 65, label: '65–79', token: '--sw-map-score-good' },
  { key: 'fair', min: 50, label: '50–64', token: '--sw-map-score-fair' },
  { key: 'low', min: 0, label: 'below 50', token: '--sw-map-score-low' },
] as const;

/** Days since the last mowing, from the freshest; bounds are inclusive upper limits. */
const MOWING_BANDS = [
  { key: 'fresh', max: 3, label: '0–3 days', token: '--sw-map-mow-fresh' },
  { key: 'week', max: 7, label: '4–7 days', token: '--sw-map-mow-week' },
  { key: 'fortnight', max: 14, label: '8–14 days', token: '--sw-map-mow-fortnight' },
  { key: 'long', max: Infinity, label: 'over 14 days', token: '--sw-map-mow-long' },
] as const;

const NONE = '--sw-map-none';

const LEGENDS: Record<MapTheme, LegendEntry[]> = {
  level: LEVELS.map((l) => ({ key: `level-${l}`, label: `${l} ${LEVEL_NAMES[l]}`, token: `--sw-level-${l}` })),
  score: [
    ...SCORE_BANDS.map((b) => ({ key: `score-${b.key}`, label: b.label, token: b.token })),
    { key: 'score-none', label: 'no field check', token: NONE },
  ],
  mowing: [
    { key: 'mow-overdue', label: 'overdue (above 1.5 × HOC)', token: '--sw-map-mow-overdue', dashed: true },
    ...MOWING_BANDS.map((b) => ({ key: `mow-${b.key}`, label: b.label, token: b.token })),
    { key: 'mow-none', label: 'no mowing recorded', token: NONE },
  ],
  status: [
    { key: 'status-open', label: FIELD_STATUS_LABELS.open, token: '--sw-status-open' },
    { key: 'status-restricted', label: FIELD_STATUS_LABELS.restricted, token: '--sw-status-restricted' },
    { key: 'status-closed', label: FIELD_STATUS_LABELS.closed, token: '--sw-status-closed', dashed: true },
    { key: 'status-retired', label: FIELD_STATUS_LABELS.retired, token: '--sw-status-retired', dashed: true },
  ],
};

export function legendFor(theme: MapTheme): LegendEntry[] {
  return LEGENDS[theme];
}

/** The legend entry key of a field under a theme. */
export function classify(theme: MapTheme, field: ThemedField): string {
  switch (theme) {
    case 'level':
      return `level-${field.maintenanceLevel}`;
    case 'score': {
      if (field.score === null) return 'score-none';
      const band = SCORE_BANDS.find((b) => (field.score as number) >= b.min);
      return `score-${band?.key ?? 'low'}`;
    }
    case 'mowing': {
      if (field.overdue) return 'mow-overdue';
      if (field.daysSinceMowing === null) return 'mow-none';
      const days = Math.max(0, field.daysSinceMowing);
      const band = MOWING_BANDS.find((b) => days <= b.max);
      return `mow-${band?.key ?? 'long'}`;
    }
    case 'status':
      return `status-${field.status}`;
  }
}

/** Counts of fields per legend entry, in legend order (for the legend's numbers). */
export function tally(theme: MapTheme, fields: readonly ThemedField[]): Record<string, number> {
  const counts: Record<string, number> = Object.fromEntries(legendFor(theme).map((e) => [e.key, 0]));
  for (const f of fields) {
    const key = classify(theme, f);
    counts[key] = (counts[key] ?? 0) + 1;
  }
  return counts;
}

export interface PolygonStyle {
  fillColor: string;
  fillOpacity: number;
  color: string;
  weight: number;
  opacity: number;
  dashArray?: string;
}

/**
 * The path style of a field: the fill of its legend entry, a dark thin outline, and a
 * dashed heavier one for entries that must read without colour.
 */
export function styleFor(theme: MapTheme, field: ThemedField, resolve: (token: string) => string, selected = false): PolygonStyle {
  const key = classify(theme, field);
  const entry = LEGENDS[theme].find((e) => e.key === key) ?? { key, label: key, token: NONE };
  const style: PolygonStyle = {
    fillColor: resolve(entry.token),
    fillOpacity: 0.78,
    color: resolve('--sw-map-outline'),
    weight: entry.dashed ? 2 : 0.8,
    opacity: entry.dashed ? 0.9 : 0.55,
  };
  if (entry.dashed) style.dashArray = '5 4';
  if (selected) Object.assign(style, { weight: 3, opacity: 1, color: resolve('--sw-clay-500') });
  return style;
}
