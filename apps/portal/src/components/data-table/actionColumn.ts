import { ElButton } from 'element-plus';
import { h } from 'vue';
import type { DataColumn } from './features.ts';

/** A trailing column with one small button per row, shown only where `allowed` says so. */
export function actionColumn<Row extends { id: number }>(label: string, allowed: (row: Row) => boolean, onClick: (row: Row) => void, testPrefix: string): DataColumn<Row> {
  return actionsColumn([{ label, allowed, onClick, testPrefix }]);
}

export interface RowAction<Row> {
  label: string;
  allowed: (row: Row) => boolean;
  onClick: (row: Row) => void;
  testPrefix: string;
  danger?: boolean;
}

/** A trailing column with several small buttons per row (e.g. Edit and Delete), each shown where allowed. */
export function actionsColumn<Row extends { id: number }>(actions: RowAction<Row>[]): DataColumn<Row> {
  return {
    id: 'actions',
    header: '',
    enableSorting: false,
    enableGlobalFilter: false,
    enableHiding: false,
    meta: { exportable: false, align: 'right' },
    cell: (c) => {
      const row = c.row.original;
      const buttons = actions
        .filter((a) => a.allowed(row))
        .map((a) => h(ElButton, { link: true, type: a.danger ? 'danger' : 'primary', size: 'small', 'data-test': `${a.testPrefix}-${row.id}`, onClick: () => a.onClick(row) }, () => a.label));
      return buttons.length ? h('span', { style: 'display:inline-flex;gap:8px' }, buttons) : null;
    },
  };
}
