import { flushPromises, mount } from '@vue/test-utils';
import ElementPlus from 'element-plus';
import { beforeEach, describe, expect, test, vi } from 'vitest';
import { computed, nextTick } from 'vue';
import DataTable from './DataTable.vue';
import { columnHelper, labelled } from './features.ts';

interface Row {
  name: string;
  level: number;
  district: string;
  areaM2?: number;
}

const LEVEL_NAMES: Record<number, string> = { 1: 'Showcase', 2: 'Competition', 3: 'Community', 4: 'Open space' };
const col = columnHelper<Row>();
const columns = [
  col.accessor('name', { header: 'Name' }),
  col.accessor('level', { header: 'Level', filterFn: 'equals', meta: { text: (v: number) => `${v} ${LEVEL_NAMES[v]}` } }),
  col.accessor('district', { header: 'District', filterFn: 'equals' }),
  col.accessor('areaM2', { header: 'Area', meta: { exportHeader: 'Area (ac)', exportValue: (m2: number) => Math.round((m2 / 4046.8564224) * 100) / 100 } }),
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

beforeEach(() => localStorage.clear());

const headers = (w: ReturnType<typeof mountTable>) => w.findAll('thead th').map((th) => th.text().replace(/[▲▼↕]/g, '').trim());
type Exposed = { csvText: () => string; table: { getColumn: (id: string) => { toggleVisibility: (v: boolean) => void; setFilterValue: (v: unknown) => void } } };

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

  test('should hide a column chosen in the column menu and remember the choice for that table', async () => {
    const w = mountTable(rows(3));
    expect(headers(w)).toEqual(['Name', 'Level', 'District', 'Area']);
    await w.get('[data-test="table-columns"]').trigger('click');
    await flushPromises();
    const box = w.get('[data-test="column-district"] input');
    await box.setValue(false);
    await nextTick();
    expect(headers(w)).toEqual(['Name', 'Level', 'Area']);
    expect(w.findAll('[data-test="row"]')[0]!.findAll('td')).toHaveLength(3);
    expect(JSON.parse(localStorage.getItem('swardwise.table.fields.columns')!)).toEqual({ district: false });
    w.unmount();

    const again = mountTable(rows(3));
    expect(headers(again)).toEqual(['Name', 'Level', 'Area']);
    const other = mount(DataTable<Row>, { props: { data: rows(3), columns, label: 'sites' }, global: { plugins: [ElementPlus] } });
    expect(other.findAll('thead th')).toHaveLength(4);
  });

  test('should keep at least one column visible', async () => {
    const w = mountTable(rows(2));
    const table = (w.vm as unknown as Exposed).table;
    for (const id of ['level', 'district', 'areaM2']) table.getColumn(id).toggleVisibility(false);
    await nextTick();
    await w.get('[data-test="table-columns"]').trigger('click');
    await flushPromises();
    expect(w.get('[data-test="column-name"] input').attributes('disabled')).toBeDefined();
  });

  test('should export the filtered rows of every page and the visible columns as CSV, with units in the headers', async () => {
    const data = rows(12).map((r, i) => ({ ...r, name: i === 0 ? 'Field "A", north' : r.name, areaM2: 4046.8564224 * (i + 1) }));
    const w = mountTable(data, 5);
    const exposed = w.vm as unknown as Exposed;
    exposed.table.getColumn('district').setFilterValue('North');
    exposed.table.getColumn('level').toggleVisibility(false);
    await nextTick();
    const lines = exposed.csvText().split('\r\n');
    expect(lines[0]).toBe('Name,District,Area (ac)');
    // Six North rows over two pages of five, all exported.
    expect(lines).toHaveLength(7);
    expect(lines[1]).toBe('Field 02,North,2');
    expect(lines.at(-1)).toBe('Field 12,North,12');

    exposed.table.getColumn('district').setFilterValue('South');
    await nextTick();
    expect(exposed.csvText().split('\r\n')[1]).toBe('"Field ""A"", north",South,1');
  });
});

describe('DataTable over a query', () => {
  const query = (data: Row[] | null, error: string | null) => {
    const refetch = vi.fn(async () => undefined);
    return { data: computed(() => data), loading: computed(() => false), error: computed(() => error), refetch };
  };

  test('should show the rows of the query', () => {
    const w = mount(DataTable<Row>, { props: { query: query(rows(3), null), columns, label: 'fields' }, global: { plugins: [ElementPlus] } });
    expect(names(w)).toEqual(['Field 01', 'Field 02', 'Field 03']);
    expect(w.find('[data-test="load-error"]').exists()).toBe(false);
  });

  test('should show the load error in place of the table and read again on Try again', async () => {
    const q = query(null, 'The server did not answer.');
    const w = mount(DataTable<Row>, { props: { query: q, columns, label: 'fields' }, global: { plugins: [ElementPlus] } });
    expect(w.get('[data-test="load-error"]').text()).toContain('The server did not answer.');
    expect(w.find('[data-test="table-fields"]').exists()).toBe(false);
    await w.get('[data-test="load-error"] button').trigger('click');
    expect(q.refetch).toHaveBeenCalledTimes(1);
  });
});

describe('labelled', () => {
  test('should show, search and filter a code by its label', () => {
    const KINDS: Record<string, string> = { park: 'Park', school: 'School campus' };
    const byKind = columnHelper<{ kind: string }>().accessor('kind', { header: 'Kind', ...labelled(KINDS) });
    const w = mount(DataTable<{ kind: string }>, {
      props: { data: [{ kind: 'school' }, { kind: 'park' }], columns: [byKind], label: 'sites', filters: [{ column: 'kind', label: 'Kind' }] },
      global: { plugins: [ElementPlus] },
    });
    expect(w.findAll('[data-test="row"] td').map((td) => td.text())).toEqual(['School campus', 'Park']);
    expect(byKind.filterFn).toBe('equals');
    expect(byKind.meta?.text?.('school')).toBe('School campus');
  });
});
