import { abilitiesPlugin } from '@casl/vue';
import { defineAbilityFor, type Actor } from '@swardwise/domain';
import { mount } from '@vue/test-utils';
import ElementPlus from 'element-plus';
import { describe, expect, test, vi } from 'vitest';
import { defineComponent, h, type VNodeChild } from 'vue';
import { useRowActions } from './useRowActions.ts';

interface Row {
  id: number;
  districtId: number;
}
const foreman: Actor = { id: 4, role: 'foreman', districtId: 1, crewId: null, siteIds: [] };
const head: Actor = { id: 2, role: 'head', districtId: null, crewId: null, siteIds: [] };

/** Renders the actions cell of `row` as `actor` sees it, with spies for Edit and Delete. */
function actionsOf(actor: Actor, row: Row, withDelete = true) {
  const edit = vi.fn();
  const remove = vi.fn();
  const Cell = defineComponent(() => {
    const rowActions = useRowActions<Row>('Crew', 'crew');
    const column = rowActions(edit, withDelete ? remove : undefined);
    return () => h('div', [(column.cell as (c: { row: { original: Row } }) => VNodeChild)({ row: { original: row } })]);
  });
  const w = mount(Cell, { global: { plugins: [ElementPlus, [abilitiesPlugin, defineAbilityFor(actor)]] } });
  return { w, edit, remove };
}

describe('useRowActions', () => {
  test('should offer Edit and Delete on a row the person may change and delete, each calling its own handler with the row', async () => {
    const row = { id: 7, districtId: 1 };
    const { w, edit, remove } = actionsOf(foreman, row);
    expect(w.findAll('button').map((b) => b.text())).toEqual(['Edit', 'Delete']);
    await w.find('[data-test="edit-crew-7"]').trigger('click');
    expect(edit).toHaveBeenCalledWith(row);
    await w.find('[data-test="delete-crew-7"]').trigger('click');
    expect(remove).toHaveBeenCalledWith(row);
  });

  test('should offer nothing on a row of another district', () => {
    const { w } = actionsOf(foreman, { id: 8, districtId: 2 });
    expect(w.findAll('button')).toHaveLength(0);
  });

  test('should offer no Delete where none is given or the person may not delete', () => {
    expect(actionsOf(foreman, { id: 7, districtId: 1 }, false).w.findAll('button').map((b) => b.text())).toEqual(['Edit']);
    // The head reads crews but neither changes nor deletes them.
    expect(actionsOf(head, { id: 7, districtId: 1 }).w.findAll('button')).toHaveLength(0);
  });
});
