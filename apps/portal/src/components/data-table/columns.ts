import type { UnitSystem } from '@swardwise/domain';
import { h } from 'vue';
import { RouterLink } from 'vue-router';
import { formatLandArea, landAreaUnit, landAreaValue } from '../../utils/units.ts';

/** Column pieces several tables share, so a site's link or an area reads the same in each. */

/** A cell that links by its text to a page of the portal (a site's, a field's). */
export function linkCell(to: string, text: string) {
  return h(RouterLink, { to, class: 'sw-link' }, () => text);
}

/** A cell with nothing to show (no value on record, not measured): a muted dash. */
export function emptyCell() {
  return h('span', { class: 'sw-muted' }, '—');
}

/** The options of the District column over a row's `districtName`, which a select filters by. */
export const districtColumn = { id: 'district', header: 'District', filterFn: 'equals' } as const;

/** The options of a land-area column (m²): shown in acres or hectares, exported as a plain number in that unit. */
export function landAreaColumn(header: string, units: UnitSystem) {
  return {
    id: 'area',
    header,
    enableGlobalFilter: false,
    meta: { align: 'right' as const, exportHeader: `${header} (${landAreaUnit(units)})`, exportValue: (m2: number) => landAreaValue(m2, units) },
    cell: (c: { getValue: () => number }) => formatLandArea(c.getValue(), units),
  };
}
