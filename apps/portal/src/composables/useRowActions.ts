import { useAbility } from '@casl/vue';
import { asSubject, type AppAbility, type ScopedRow, type SubjectName } from '@swardwise/domain';
import { actionsColumn, type RowAction } from '../components/data-table/actionColumn.ts';
import type { DataColumn } from '../components/data-table/features.ts';

/**
 * The Edit (and Delete) buttons of a list of `subject` rows, each shown only where the person
 * may update (delete) that row; their test ids are `edit-<noun>-<id>` and `delete-<noun>-<id>`.
 * Call it in setup (it reads the ability there); the column it returns may be built later.
 */
export function useRowActions<Row extends ScopedRow & { id: number }>(subject: SubjectName, noun: string) {
  const ability = useAbility<AppAbility>();
  return function rowActions(edit: (row: Row) => void, remove?: (row: Row) => void): DataColumn<Row> {
    const actions: RowAction<Row>[] = [{ label: 'Edit', allowed: (row) => ability.can('update', asSubject(subject, row)), onClick: edit, testPrefix: `edit-${noun}` }];
    if (remove) actions.push({ label: 'Delete', danger: true, allowed: (row) => ability.can('delete', asSubject(subject, row)), onClick: remove, testPrefix: `delete-${noun}` });
    return actionsColumn(actions);
  };
}
