import { useTable, type PaginationState, type SortingState, type Updater } from '@tanstack/react-table';
import { dataTableFeatures, type DataTableColumns, type DataTableInstance } from '@/components/ui/data-table-columns';

/**
 * For lists too long to send whole: the server filters and pages, the table shows one page and asks
 * for others. With `sorting` and `onSortingChange` the server sorts too; without them sorting orders
 * the rows of the page shown.
 */
export interface DataTableServerPaging {
  sorting?: SortingState;
  onSortingChange?: (sorting: SortingState) => void;
  rowCount: number;
  pageIndex: number;
  onPageChange: (pageIndex: number) => void;
  filter: string;
  onFilterChange: (filter: string) => void;
  /** True while another page loads, so the rows shown are not mistaken for it. */
  isFetching?: boolean;
}

/** The table instance: sorting, filtering and paging in the browser, or handed to the server. */
export function useDataTable<TData extends object>(options: {
  columns: DataTableColumns<TData>;
  data: TData[];
  getRowId: (row: TData) => string;
  pageSize: number;
  initialSorting: SortingState;
  server?: DataTableServerPaging;
}): DataTableInstance<TData> {
  const { columns, data, getRowId, pageSize, initialSorting, server } = options;
  return useTable({
    features: dataTableFeatures,
    columns,
    data,
    getRowId,
    globalFilterFn: 'includesString',
    enableSortingRemoval: false,
    initialState: { sorting: initialSorting, pagination: { pageIndex: 0, pageSize }, globalFilter: '' },
    ...(server
      ? {
          manualPagination: true,
          manualFiltering: true,
          rowCount: server.rowCount,
          state: { pagination: { pageIndex: server.pageIndex, pageSize } },
          onPaginationChange: (updater: Updater<PaginationState>) => {
            const next = typeof updater === 'function' ? updater({ pageIndex: server.pageIndex, pageSize }) : updater;
            server.onPageChange(next.pageIndex);
          },
          ...(server.sorting && server.onSortingChange
            ? {
                manualSorting: true,
                state: { pagination: { pageIndex: server.pageIndex, pageSize }, sorting: server.sorting },
                onSortingChange: (updater: Updater<SortingState>) => {
                  const next = typeof updater === 'function' ? updater(server.sorting!) : updater;
                  server.onSortingChange!(next);
                },
              }
            : {}),
        }
      : {}),
  });
}
