import { mount } from '@vue/test-utils';
import ElementPlus from 'element-plus';
import { describe, expect, test } from 'vitest';
import { nextTick } from 'vue';
import DataTable from './DataTable.vue';
import { columnHelper } from './features.ts';

interface Row {
  name: string;
  level: number;
  district: string;
}

const LEVEL_NAMES: Record<number, string> = { 1: 'Showcase', 2: 'Competition', 3: 'Community', 4: 'Open space' };
const col = columnHelper<Row>();
const columns = [
  col.accessor('name', { header: 'Name' }),
  col.accessor('level', { header: 'Level', filterFn: 'equals', meta: { text: (v: number) => `${v} ${LEVEL_NAMES[v]}` } }),
  col.accessor('district', { header: 'District', filterFn: 'equals' }),
];

function rows(n: number): Row[] {
  return Array.from({ length: n }, (_, i) => ({
    name: `Field ${String(i + 1).padStart(2, '0')}`,
    level: (i % 4) + 1,
    district: i % 2 ? 'North' : 'South',
  }));
}

function mountTable(data: Row[], pageSize = 25) {
  return mount(DataTable<Row>, {
    props: { data, columns, label: 'fields', pageSize, filters: [{ column: 'level', label: 'Level' }] },
    global: { plugins: [ElementPlus] },
  });
}

const names = (w: ReturnType<typeof mountTable>) =>
  w.findAll('[data-test="row"]').map((r) => r.findAll('td')[0]!.text());

describe('DataTable', () => {
  test('should sort by a column when its header is clicked, ascending then descending', async () => {
    const w = mountTable([
      { name: 'Birch', level: 2, district: 'North' },
      { name: 'Aspen', level: 1, district: 'South' },
      { name: 'Cedar', level: 3, district: 'North' },
    ]);
    expect(names(w)).toEqual(['Birch', 'Aspen', 'Cedar']);
    await w.get('[data-test="sort-name"]').trigger('click');
    expect(names(w)).toEqual(['Aspen', 'Birch', 'Cedar']);
    await w.get('[data-test="sort-name"]').trigger('click');
    expect(names(w)).toEqual(['Cedar', 'Birch', 'Aspen']);
  });

  test('should filter rows with the global search, matching the readable text of a value', async () => {
    const w = mountTable(rows(8));
    await w.get('input[data-test="table-search"]').setValue('showcase');
    await nextTick();
    expect(names(w)).toEqual(['Field 01', 'Field 05']);
    expect(w.get('[data-test="table-count"]').text()).toContain('2 of 8');
  });

  test('should filter by a column value and offer that column’s values as options', async () => {
    const w = mountTable(rows(8));
    const table = (w.vm as unknown as { table: { getColumn: (id: string) => { setFilterValue: (v: unknown) => void } } }).table;
    table.getColumn('level')!.setFilterValue(3);
    await nextTick();
    expect(names(w)).toEqual(['Field 03', 'Field 07']);
    table.getColumn('level')!.setFilterValue(undefined);
    await nextTick();
    expect(names(w)).toHaveLength(8);
  });

  test('should show one page of rows and move to the next page', async () => {
    const w = mountTable(rows(12), 5);
    expect(names(w)).toEqual(['Field 01', 'Field 02', 'Field 03', 'Field 04', 'Field 05']);
    await w.get('.el-pagination .btn-next').trigger('click');
    expect(names(w)).toEqual(['Field 06', 'Field 07', 'Field 08', 'Field 09', 'Field 10']);
    await w.get('.el-pagination .btn-next').trigger('click');
    expect(names(w)).toEqual(['Field 11', 'Field 12']);
  });

  test('should say so when the data is empty', () => {
    const w = mountTable([]);
    expect(w.get('[data-test="table-empty"]').text()).toBe('Nothing to show.');
  });
});
