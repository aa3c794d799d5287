import type { FieldRecord } from '@swardwise/domain';
import { mount } from '@vue/test-utils';
import ElementPlus from 'element-plus';
import { beforeEach, describe, expect, test } from 'vitest';
import DataTable from '../data-table/DataTable.vue';
import { actualShare, fieldRecordColumns, mowingShare } from './recordColumns.ts';

const FIELD: FieldRecord = {
  fieldId: 1,
  fieldName: 'Pitch 1',
  siteName: 'Alder Green',
  plannedHours: 24.04,
  plannedHoursDone: 20.04,
  actualHours: 18.46,
  ordersDone: 10,
  ordersSkipped: 1,
  ordersOpen: 2,
  mowingsAsked: 12,
  mowingsDone: 11,
  mowingsLate: 2,
  mowingsMissed: 1,
};

beforeEach(() => localStorage.clear());

describe('record columns', () => {
  test('should give actual against planned and mowings done against asked in whole percent, blank when nothing was asked', () => {
    expect(actualShare({ plannedHoursDone: 20, actualHours: 18.46 })).toBe(92);
    expect(actualShare({ plannedHoursDone: 0, actualHours: 0 })).toBeNull();
    expect(mowingShare({ mowingsAsked: 12, mowingsDone: 11 })).toBe(92);
    expect(mowingShare({ mowingsAsked: 0, mowingsDone: 0 })).toBeNull();
  });

  test('should show the per-field row and export it as plain numbers under full headers', () => {
    const w = mount(DataTable<FieldRecord>, {
      props: { data: [FIELD, { ...FIELD, fieldId: 2, fieldName: 'Lawn', mowingsAsked: 0, mowingsDone: 0, mowingsLate: 0 }], columns: fieldRecordColumns(), label: 'records-fields' },
      global: { plugins: [ElementPlus] },
    });
    const cells = w.findAll('[data-test="row"]')[0]!.findAll('td').map((td) => td.text());
    // Actual is compared with the planned hours of the done orders (20.04), not of all (24.04).
    expect(cells).toEqual(['Pitch 1', 'Alder Green', '24:02', '18:28', '92 %', '12', '11', '2', '1', '92 %']);
    expect(w.findAll('[data-test="row"]')[1]!.findAll('td').at(-1)!.text()).toBe('—');
    const csv = (w.vm as unknown as { csvText: () => string }).csvText().split(/\r?\n/);
    expect(csv[0]).toBe('Field,Site,Planned h,Actual h,Actual / planned of done orders (%),Mowings asked,Mowings done,Mowings late,Mowings missed,Mowings done / asked (%)');
    expect(csv[1]).toBe('Pitch 1,Alder Green,24,18.5,92,12,11,2,1,92');
  });
});
