/** The light hover summary of a field: name, site and the value of the theme shown. */
import { FIELD_STATUS_LABELS, LEVEL_NAMES, type Level, type MapField } from '@swardwise/domain';
import type { MapTheme } from './themes.ts';

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** The theme's value of a field in plain words. */
function themeValue(field: MapField, theme: MapTheme): string {
  switch (theme) {
    case 'level':
      return `Level ${field.maintenanceLevel} ${LEVEL_NAMES[field.maintenanceLevel as Level]}`;
    case 'score':
      return field.score === null ? 'No field check yet' : `Surface score ${Math.round(field.score)}`;
    case 'mowing':
      if (field.daysSinceMowing === null) return 'No mowing recorded';
      return `${field.daysSinceMowing} ${field.daysSinceMowing === 1 ? 'day' : 'days'} since mowing${field.overdue ? ' · overdue' : ''}`;
    case 'status':
      return FIELD_STATUS_LABELS[field.status];
  }
}

export function fieldTooltip(field: MapField, siteName: string, theme: MapTheme): string {
  return `<strong>${escapeHtml(field.name)}</strong><br>${escapeHtml(siteName)}<br>${escapeHtml(themeValue(field, theme))}`;
}
