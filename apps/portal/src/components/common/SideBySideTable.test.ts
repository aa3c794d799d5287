import { mount } from '@vue/test-utils';
import { describe, expect, test } from 'vitest';
import { h } from 'vue';
import SideBySideTable from './SideBySideTable.vue';

const columns = [
  { id: 3, name: 'Alder Run' },
  { id: 8, name: 'Birch Hollow' },
];
const lines = [
  { group: 'Mowing', label: 'Mowings', key: 'mow', value: (c: { id: number }) => `${c.id * 2}` },
  { label: 'Hours', key: 'hours', value: (c: { id: number }) => `${c.id} h` },
];

const mountTable = () =>
  mount(SideBySideTable<(typeof columns)[number], (typeof lines)[number]>, {
    props: {
      columns,
      lines,
      corner: 'Figure',
      columnKey: (c) => c.id,
      cell: (line, c) => line.value(c),
      columnTest: (c) => `col-${c.id}`,
      cellTest: (line, c) => `cell-${c.id}-${line.key}`,
      lineClass: (line) => ({ total: line.key === 'hours' }),
    },
    slots: { column: ({ column }: { column: (typeof columns)[number] }) => h('strong', column.name) },
  });

describe('SideBySideTable', () => {
  test('should head each column from the slot and each row with its label, under the corner heading', () => {
    const w = mountTable();
    const heads = w.findAll('thead th');
    expect(heads.map((th) => th.text())).toEqual(['Figure', 'Alder Run', 'Birch Hollow']);
    expect(heads.every((th) => th.attributes('scope') === 'col')).toBe(true);
    expect(w.find('[data-test="col-8"] strong').text()).toBe('Birch Hollow');
    expect(w.findAll('tbody th[scope="row"]').map((th) => th.text())).toEqual(['Mowings', 'Hours']);
  });

  test('should fill each cell from its line and column, with its test id and the line class', () => {
    const w = mountTable();
    expect(w.find('[data-test="cell-3-mow"]').text()).toBe('6');
    expect(w.find('[data-test="cell-8-hours"]').text()).toBe('8 h');
    expect(w.find('[data-test="cell-8-hours"]').element.parentElement?.classList.contains('total')).toBe(true);
    expect(w.find('[data-test="cell-8-mow"]').element.parentElement?.classList.contains('total')).toBe(false);
  });

  test('should put a group heading across every column before the first row of its group', () => {
    const w = mountTable();
    const rows = w.findAll('tbody tr');
    expect(rows).toHaveLength(3);
    const group = rows[0]!.find('th');
    expect(group.text()).toBe('Mowing');
    expect(group.attributes('scope')).toBe('colgroup');
    expect(group.attributes('colspan')).toBe('3');
  });
});
