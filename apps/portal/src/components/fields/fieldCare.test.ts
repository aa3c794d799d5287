import { mount } from '@vue/test-utils';
import ElementPlus from 'element-plus';
import type { FieldRow, MapField } from '@swardwise/domain';
import { beforeEach, describe, expect, test } from 'vitest';
import { createMemoryHistory, createRouter } from 'vue-router';
import DataTable from '../data-table/DataTable.vue';
import { careColumns, withCare, type FieldCareRow } from './fieldCare.ts';
import { fieldColumns } from './fieldColumns.ts';
import type { DataColumn } from '../data-table/features.ts';

const field = (id: number, name: string) => ({ id, name, siteId: 1, siteName: 'Alder Park', districtId: 1, districtName: 'North', sport: 'soccer', grass: 'tall_fescue', maintenanceLevel: 2, status: 'open', statusNote: '', areaM2: 7000, hocOverrideMm: null }) as unknown as FieldRow;
const care = (id: number, m: Partial<MapField>) =>
  ({ id, lastMowedOn: null, mowDueOn: null, mowDueState: 'never', mowWaitingForGrowth: false, overdue: null, checkDueOn: null, checkState: 'ok', score: null, scoredOn: null, ...m }) as MapField;

const rows = withCare(
  [field(1, 'Birch'), field(2, 'Aspen'), field(3, 'Cedar')],
  [
    care(1, { lastMowedOn: '2026-11-28', mowDueOn: '2026-12-01', mowDueState: 'overdue', checkDueOn: '2026-12-10', score: 71 }),
    care(2, { lastMowedOn: '2026-11-30', mowDueOn: null, mowDueState: 'ok', checkDueOn: '2026-11-20', checkState: 'overdue', score: 80 }),
    care(3, { lastMowedOn: '2026-11-10', mowDueState: 'ok', mowWaitingForGrowth: true, checkDueOn: '2026-12-20', score: 64 }),
  ],
);

function mountTable() {
  const router = createRouter({ history: createMemoryHistory(), routes: [{ path: '/:p(.*)*', component: { render: () => null } }] });
  const columns = [...(fieldColumns('imperial', ['name']) as DataColumn<FieldCareRow>[]), ...careColumns(['lastMowed', 'mowDue', 'overdue', 'checkDue', 'score'])];
  return mount(DataTable<FieldCareRow>, { props: { data: rows, columns, label: 'fields', filters: [{ column: 'overdue', label: 'Overdue' }] }, global: { plugins: [ElementPlus, router] } });
}
const names = (w: ReturnType<typeof mountTable>) => w.findAll('[data-test="row"]').map((r) => r.findAll('td')[0]!.text());

beforeEach(() => localStorage.clear());

describe('fieldCare', () => {
  test('should mark what is overdue: a mowing past its due day, a check past its level\u2019s interval', () => {
    expect(rows.map((r) => r.overdue)).toEqual(['mowing', 'check', 'none']);
  });

  test('should sort the fields list by last mowed, next mowing due, overdue and surface score', async () => {
    const w = mountTable();
    await w.get('[data-test="sort-lastMowed"]').trigger('click');
    expect(names(w)).toEqual(['Cedar', 'Birch', 'Aspen']);
    // Numbers sort highest first, then lowest.
    await w.get('[data-test="sort-score"]').trigger('click');
    expect(names(w)).toEqual(['Aspen', 'Birch', 'Cedar']);
    await w.get('[data-test="sort-score"]').trigger('click');
    expect(names(w)).toEqual(['Cedar', 'Birch', 'Aspen']);
    await w.get('[data-test="sort-overdue"]').trigger('click');
    expect(names(w)[2]).toBe('Cedar');
    await w.get('[data-test="sort-mowDue"]').trigger('click');
    // Only Birch has a due day; the rest go last.
    expect(names(w)[0]).toBe('Birch');
    expect(w.text()).toContain('not growing');
  });

  test('should filter the list to the overdue ones', async () => {
    const w = mountTable();
    (w.vm as unknown as { table: { getColumn: (id: string) => { setFilterValue: (v: unknown) => void } } }).table.getColumn('overdue').setFilterValue('check');
    await w.vm.$nextTick();
    expect(names(w)).toEqual(['Aspen']);
  });
});
