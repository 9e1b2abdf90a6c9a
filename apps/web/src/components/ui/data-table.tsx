import type { ReactNode } from 'react';
import type { SortingState } from '@tanstack/react-table';
import type { DataTableColumns } from '@/components/ui/data-table-columns';
import { DataTableFilter, DataTableSortControls } from '@/components/ui/data-table-controls';
import { DataTableGrid } from '@/components/ui/data-table-grid';
import { DataTableCount, DataTablePager } from '@/components/ui/data-table-pager';
import { useDataTable, type DataTableServerPaging } from '@/components/ui/use-data-table';

interface DataTableProps<TData extends object> {
  /** Keep stable (module scope or useMemo): a new array each render rebuilds every row model. */
  columns: DataTableColumns<TData>;
  data: TData[];
  getRowId: (row: TData) => string;
  /** Read by screen readers as the table's name. */
  caption: string;
  filterLabel: string;
  /** Plural noun for the count line, e.g. "members". */
  itemsLabel: string;
  emptyMessage: string;
  pageSize?: number;
  initialSorting?: SortingState;
  server?: DataTableServerPaging;
  /** Controls above the table that narrow it further, e.g. filters by kind or place. */
  toolbar?: ReactNode;
}

/**
 * The one table over TanStack Table: a filter box, sorting (column headers, or a select on a phone),
 * a count line, the rows, and pages. Columns come from the feature's *-columns.tsx, built with
 * createDataTableColumnHelper (data-table-columns.ts).
 */
export function DataTable<TData extends object>({
  columns,
  data,
  getRowId,
  caption,
  filterLabel,
  itemsLabel,
  emptyMessage,
  pageSize = 10,
  initialSorting = [],
  server,
  toolbar,
}: DataTableProps<TData>) {
  const table = useDataTable({ columns, data, getRowId, pageSize, initialSorting, server });
  const filter = server ? server.filter : String(table.state.globalFilter ?? '');
  const setFilter = server ? server.onFilterChange : (value: string) => table.setGlobalFilter(value);
  const { pageIndex } = table.state.pagination;
  const matching = server ? server.rowCount : table.getPrePaginatedRowModel().rows.length;

  return (
    <div className="space-y-3">
      <DataTableFilter label={filterLabel} value={filter} onChange={setFilter} />
      {toolbar}
      <DataTableSortControls table={table} />
      <DataTableCount
        matching={matching}
        first={matching === 0 ? 0 : pageIndex * pageSize + 1}
        last={Math.min(matching, (pageIndex + 1) * pageSize)}
        itemsLabel={itemsLabel}
        filter={filter}
        isFetching={server?.isFetching}
      />
      <DataTableGrid table={table} caption={caption} empty={filter ? `Nothing matches "${filter}".` : emptyMessage} />
      <DataTablePager table={table} itemsLabel={itemsLabel} />
    </div>
  );
}
