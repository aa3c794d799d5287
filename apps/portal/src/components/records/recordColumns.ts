import type { CrewRecord, FieldRecord, WeekRecord } from '@swardwise/domain';
import { h } from 'vue';
import { columnHelper } from '../data-table/features.ts';
import { hoursMinutes } from '../../utils/units.ts';
import { weekLabel } from '../week/board.ts';

const round1 = (h: number) => Math.round(h * 10) / 10;
const hours = hoursMinutes;
/** Actual hours against the planned hours of the same, done orders, in percent; blank when nothing is done. */
export function actualShare(r: { plannedHoursDone: number; actualHours: number }): number | null {
  return r.plannedHoursDone > 0 ? Math.round((r.actualHours / r.plannedHoursDone) * 100) : null;
}
/** Mowings done against asked, in percent; blank when none were asked. */
export function mowingShare(r: { mowingsAsked: number; mowingsDone: number }): number | null {
  return r.mowingsAsked > 0 ? Math.round((r.mowingsDone / r.mowingsAsked) * 100) : null;
}
/** Names stay on one line: a wrapped site name makes every row three lines tall. */
const oneLine = (text: string) => h('span', { style: { whiteSpace: 'nowrap' } }, text);
const pct = (v: number | null) => (v === null ? '—' : `${v} %`);
const right = { align: 'right' as const };

/** A share in percent (— where there is nothing to compare with), exported as the plain number. */
function shareColumn<T extends object>(col: ReturnType<typeof columnHelper<T>>, id: string, header: string, exportHeader: string, share: (r: T) => number | null) {
  return col.accessor((r) => share(r), { id, header, enableGlobalFilter: false, meta: { ...right, exportHeader, exportValue: (v: number | null) => v }, cell: (c) => pct(c.getValue()) });
}

function hourColumns<T extends { plannedHours: number; actualHours: number; plannedHoursDone: number }>(col: ReturnType<typeof columnHelper<T>>) {
  return [
    col.accessor((r) => r.plannedHours, { id: 'planned', header: 'Planned h', enableGlobalFilter: false, meta: { ...right, exportValue: round1 }, cell: (c) => hours(c.getValue()) }),
    col.accessor((r) => r.actualHours, { id: 'actual', header: 'Actual h', enableGlobalFilter: false, meta: { ...right, exportValue: round1 }, cell: (c) => hours(c.getValue()) }),
    shareColumn(col, 'share', 'Actual %', 'Actual / planned of done orders (%)', actualShare),
  ];
}

function mowingColumns<T extends { mowingsAsked: number; mowingsDone: number; mowingsLate: number; mowingsMissed: number }>(col: ReturnType<typeof columnHelper<T>>) {
  return [
    col.accessor((r) => r.mowingsAsked, { id: 'mowingsAsked', header: 'Mow asked', enableGlobalFilter: false, meta: { ...right, exportHeader: 'Mowings asked' } }),
    col.accessor((r) => r.mowingsDone, { id: 'mowingsDone', header: 'Mowed', enableGlobalFilter: false, meta: { ...right, exportHeader: 'Mowings done' } }),
    col.accessor((r) => r.mowingsLate, { id: 'mowingsLate', header: 'Late', enableGlobalFilter: false, meta: { ...right, exportHeader: 'Mowings late' } }),
    col.accessor((r) => r.mowingsMissed, { id: 'mowingsMissed', header: 'Missed', enableGlobalFilter: false, meta: { ...right, exportHeader: 'Mowings missed' } }),
    shareColumn(col, 'mowingShare', 'Mowed %', 'Mowings done / asked (%)', mowingShare),
  ];
}

export function fieldRecordColumns() {
  const col = columnHelper<FieldRecord>();
  return [
    col.accessor('fieldName', { header: 'Field', cell: (c) => oneLine(c.getValue()) }),
    col.accessor('siteName', { header: 'Site', filterFn: 'equals', cell: (c) => oneLine(c.getValue()) }),
    // Orders done and skipped are in the crew table and the totals; here the row would not fit.
    ...hourColumns(col),
    ...mowingColumns(col),
  ];
}

export function crewRecordColumns() {
  const col = columnHelper<CrewRecord>();
  return [
    col.accessor('crewName', { header: 'Crew', cell: (c) => oneLine(c.getValue()) }),
    ...hourColumns(col),
    col.accessor('ordersDone', { header: 'Orders done', enableGlobalFilter: false, meta: right }),
    col.accessor('ordersSkipped', { header: 'Skipped', enableGlobalFilter: false, meta: right }),
    col.accessor('ordersOpen', { header: 'Still open', enableGlobalFilter: false, meta: right }),
  ];
}

export function weekRecordColumns() {
  const col = columnHelper<WeekRecord>();
  return [
    col.accessor('weekStart', { header: 'Week', meta: { text: (v: string) => weekLabel(v), exportHeader: 'Week (Monday)', exportValue: (v: string) => v }, cell: (c) => weekLabel(c.getValue()) }),
    ...hourColumns(col),
    ...mowingColumns(col),
  ];
}
