import {
  columnFilteringFeature,
  createColumnHelper,
  createFilteredRowModel,
  createPaginatedRowModel,
  createSortedRowModel,
  filterFn_includesString,
  globalFilteringFeature,
  metaHelper,
  rowPaginationFeature,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  sortFn_datetime,
  sortFn_text,
  tableFeatures,
  type ReactTable,
  type TableOptions,
} from '@tanstack/react-table';

// What a feature's *-columns.tsx builds on: the table's features and a typed column helper.

export interface DataTableColumnMeta {
  /** The label shown beside the value when rows stack as cards on a phone; defaults to the header text. */
  cellLabel?: string;
  /** For action cells, where a label beside the buttons would only repeat them. */
  hideCellLabel?: boolean;
}

export const dataTableFeatures = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, basic: sortFn_basic, datetime: sortFn_datetime, text: sortFn_text },
  columnFilteringFeature,
  globalFilteringFeature,
  filteredRowModel: createFilteredRowModel(),
  filterFns: { includesString: filterFn_includesString },
  rowPaginationFeature,
  paginatedRowModel: createPaginatedRowModel(),
  columnMeta: metaHelper<DataTableColumnMeta>(),
});
export type DataTableFeatures = typeof dataTableFeatures;

export function createDataTableColumnHelper<TData extends object>() {
  return createColumnHelper<DataTableFeatures, TData>();
}

export type DataTableColumns<TData extends object> = TableOptions<DataTableFeatures, TData>['columns'];

/** The table instance the DataTable's parts share. */
export type DataTableInstance<TData extends object> = ReactTable<DataTableFeatures, TData>;
