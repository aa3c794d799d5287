import { FIELD_STATUS_LABELS, GRASS_LABELS, LEVEL_NAMES, SPORT_LABELS, type FieldRow, type FieldStatus, type Level, type UnitSystem } from '@swardwise/domain';
import { h } from 'vue';
import { formatHoc, hocUnit, hocValue } from '../../utils/units.ts';
import { districtColumn, landAreaColumn, linkCell } from '../data-table/columns.ts';
import { columnHelper, labelled, type DataColumn } from '../data-table/features.ts';
import LevelTag from './LevelTag.vue';
import StatusTag from './StatusTag.vue';

const col = columnHelper<FieldRow>();

export type FieldColumnKey = 'name' | 'site' | 'district' | 'sport' | 'grass' | 'level' | 'status' | 'statusNote' | 'area' | 'hoc';

/** Field table columns shared by the fields list, a site page and the landing pages. */
export function fieldColumns(units: UnitSystem, keys: FieldColumnKey[]): DataColumn<FieldRow>[] {
  const all: Record<FieldColumnKey, DataColumn<FieldRow>> = {
    name: col.accessor('name', { header: 'Field', cell: (c) => linkCell(`/fields/${c.row.original.id}`, c.getValue()) }),
    site: col.accessor('siteName', {
      id: 'site',
      header: 'Site',
      filterFn: 'equals',
      cell: (c) => linkCell(`/sites/${c.row.original.siteId}`, c.getValue()),
    }),
    district: col.accessor('districtName', districtColumn),
    sport: col.accessor('sport', { header: 'Sport', ...labelled(SPORT_LABELS) }),
    grass: col.accessor('grass', { header: 'Grass', ...labelled(GRASS_LABELS) }),
    level: col.accessor('maintenanceLevel', {
      id: 'level',
      header: 'Level',
      filterFn: 'equals',
      meta: { text: (v: Level) => `${v} ${LEVEL_NAMES[v]}` },
      cell: (c) => h(LevelTag, { level: c.getValue() }),
    }),
    status: col.accessor('status', {
      header: 'Status',
      filterFn: 'equals',
      meta: { text: (v: FieldStatus) => FIELD_STATUS_LABELS[v] },
      cell: (c) => h(StatusTag, { status: c.getValue() }),
    }),
    statusNote: col.accessor('statusNote', { header: 'Status note', enableSorting: false, cell: (c) => c.getValue() || '—' }),
    area: col.accessor('areaM2', landAreaColumn('Area', units)),
    hoc: col.accessor('hocOverrideMm', {
      id: 'hoc',
      header: 'HOC override',
      enableGlobalFilter: false,
      sortUndefined: 'last',
      meta: {
        align: 'right',
        exportHeader: `HOC override (${hocUnit(units)})`,
        exportValue: (mm: number | null) => (mm === null ? null : hocValue(mm, units)),
      },
      cell: (c) => {
        const mm = c.getValue();
        return mm === null ? h('span', { class: 'sw-muted' }, 'per Standards') : formatHoc(mm, units);
      },
    }),
  };
  return keys.map((k) => all[k]);
}
