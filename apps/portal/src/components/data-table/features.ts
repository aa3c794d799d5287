import {
  columnFilteringFeature,
  columnVisibilityFeature,
  createColumnHelper,
  createFilteredRowModel,
  createPaginatedRowModel,
  createSortedRowModel,
  filterFn_equals,
  filterFn_includesString,
  globalFilteringFeature,
  rowPaginationFeature,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  sortFn_datetime,
  sortFn_text,
  tableFeatures,
  type ColumnDef,
  type RowData,
} from '@tanstack/vue-table';

export interface DataColumnMeta {
  /** Text of a value for the global search and for select-filter options (e.g. "2 Competition"). */
  // Cell values differ per column; TanStack itself types them as any.
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  text?: (value: any) => string;
  align?: 'left' | 'right';
  /** Header of the column in a CSV export, with its unit, e.g. "Area (ac)"; defaults to the header. */
  exportHeader?: string;
  /** Value of a cell in a CSV export (a plain number in the header's unit); defaults to `text` or the value. */
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  exportValue?: (value: any) => string | number | null;
  /** Controls such as an "Edit" button: left out of the CSV export. */
  exportable?: boolean;
}

/** The features every Swardwise table has: sort, global and per-column filter, pages, column choice. */
export const dataTableFeatures = tableFeatures({
  columnVisibilityFeature,
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, basic: sortFn_basic, text: sortFn_text, datetime: sortFn_datetime },
  columnFilteringFeature,
  globalFilteringFeature,
  filteredRowModel: createFilteredRowModel(),
  filterFns: { includesString: filterFn_includesString, equals: filterFn_equals },
  rowPaginationFeature,
  paginatedRowModel: createPaginatedRowModel(),
  columnMeta: {} as DataColumnMeta,
});

export type DataTableFeatures = typeof dataTableFeatures;
// A column list mixes value types, as TanStack's own ColumnDef arrays do.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type DataColumn<TData extends RowData> = ColumnDef<DataTableFeatures, TData, any>;

export function columnHelper<TData extends RowData>() {
  return createColumnHelper<DataTableFeatures, TData>();
}

/**
 * The options of a column whose values are codes shown by their labels (a kind, a sport): the
 * cell, the search, the select filter and the export all use the label.
 */
export function labelled<V extends string | number>(labels: Record<V, string> | ((value: V) => string)) {
  const text = typeof labels === 'function' ? labels : (value: V) => labels[value] ?? String(value);
  return { filterFn: 'equals' as const, meta: { text }, cell: (c: { getValue: () => V }) => text(c.getValue()) };
}

/** A select filter above the table over one column's values. */
export interface SelectFilter {
  column: string;
  label: string;
}
