import { ElButton } from 'element-plus';
import { h } from 'vue';
import type { DataColumn } from './features.ts';

/** A trailing column with one small button per row, shown only where `allowed` says so. */
export function actionColumn<Row extends { id: number }>(label: string, allowed: (row: Row) => boolean, onClick: (row: Row) => void, testPrefix: string): DataColumn<Row> {
  return {
    id: 'actions',
    header: '',
    enableSorting: false,
    enableGlobalFilter: false,
    enableHiding: false,
    meta: { exportable: false, align: 'right' },
    cell: (c) =>
      allowed(c.row.original)
        ? h(ElButton, { link: true, type: 'primary', size: 'small', 'data-test': `${testPrefix}-${c.row.original.id}`, onClick: () => onClick(c.row.original) }, () => label)
        : null,
  };
}
