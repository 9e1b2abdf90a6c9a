import { useId, type ReactNode } from 'react';
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
  useTable,
  type PaginationState,
  type SortingState,
  type TableOptions,
  type Updater,
} from '@tanstack/react-table';
import { Button } from '@/components/ui/button';

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

const sortMarks = { asc: '▲', desc: '▼' } as const;

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
  const filterId = useId();
  const sortId = useId();
  const table = useTable({
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

  const filter = server ? server.filter : String(table.state.globalFilter ?? '');
  const setFilter = server ? server.onFilterChange : (value: string) => table.setGlobalFilter(value);
  const { pageIndex } = table.state.pagination;
  const rows = table.getRowModel().rows;
  const matching = server ? server.rowCount : table.getPrePaginatedRowModel().rows.length;
  const pageCount = Math.max(1, table.getPageCount());
  const first = matching === 0 ? 0 : pageIndex * pageSize + 1;
  const last = Math.min(matching, (pageIndex + 1) * pageSize);
  const leafCount = table.getAllLeafColumns().length;
  const activeSort = table.state.sorting[0];
  const sortable = table
    .getAllLeafColumns()
    .filter((column) => column.getCanSort())
    .map((column) => {
      const { header, meta } = column.columnDef;
      return { id: column.id, label: meta?.cellLabel ?? (typeof header === 'string' ? header : column.id) };
    });

  return (
    <div className="space-y-3">
      <div className="flex flex-col gap-1 sm:max-w-sm">
        <label htmlFor={filterId} className="text-sm font-semibold">
          {filterLabel}
        </label>
        <input
          id={filterId}
          type="search"
          value={filter}
          onChange={(event) => setFilter(event.target.value)}
          className="min-h-11 rounded-md border border-line-strong bg-card px-3 text-base"
          autoComplete="off"
        />
      </div>

      {toolbar}

      {sortable.length > 0 ? (
        // On a phone the rows stack as cards and the header row is hidden, so sorting gets its own controls.
        <div className="flex items-end gap-2 sm:hidden">
          <div className="flex min-w-0 flex-1 flex-col gap-1">
            <label htmlFor={sortId} className="text-sm font-semibold">
              Sort by
            </label>
            <select
              id={sortId}
              value={activeSort?.id ?? ''}
              onChange={(event) => table.setSorting([{ id: event.target.value, desc: activeSort?.desc ?? false }])}
              className="min-h-11 w-full rounded-md border border-line-strong bg-card px-3 text-base"
            >
              {activeSort ? null : <option value="">Choose…</option>}
              {sortable.map((column) => (
                <option key={column.id} value={column.id}>
                  {column.label}
                </option>
              ))}
            </select>
          </div>
          <Button
            variant="secondary"
            disabled={!activeSort}
            onClick={() => activeSort && table.setSorting([{ id: activeSort.id, desc: !activeSort.desc }])}
          >
            {activeSort?.desc ? 'Descending' : 'Ascending'}
          </Button>
        </div>
      ) : null}

      <p className="text-sm text-ink-muted" aria-live="polite" aria-busy={server?.isFetching || undefined}>
        {server?.isFetching ? 'Loading… ' : null}
        {matching === 0
          ? `No ${itemsLabel} to show.`
          : `Showing ${first}–${last} of ${matching} ${itemsLabel}${filter ? ` matching "${filter}"` : ''}.`}
      </p>

      <table className="w-full border-collapse text-left max-sm:block">
        <caption className="sr-only">{caption}</caption>
        <thead className="max-sm:hidden">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                const canSort = header.column.getCanSort();
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
                    className="border-b-2 border-line px-2 py-1 text-sm font-semibold text-ink-muted"
                  >
                    {header.isPlaceholder ? null : canSort ? (
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className={`inline-flex min-h-11 items-center gap-1 rounded-md px-1 hover:text-ink ${sorted ? 'text-ink' : ''}`}
                      >
                        <table.FlexRender header={header} />
                        <span aria-hidden="true" className="w-3 text-xs">
                          {sorted ? sortMarks[sorted] : ''}
                        </span>
                      </button>
                    ) : (
                      <table.FlexRender header={header} />
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody className="max-sm:block max-sm:space-y-3">
          {rows.length === 0 ? (
            <tr className="max-sm:block">
              <td colSpan={leafCount} className="px-2 py-6 text-center text-ink-muted max-sm:block">
                {filter ? `Nothing matches "${filter}".` : emptyMessage}
              </td>
            </tr>
          ) : (
            rows.map((row) => (
              <tr
                key={row.id}
                className="border-b border-line max-sm:block max-sm:rounded-lg max-sm:border max-sm:bg-card max-sm:p-3"
              >
                {row.getAllCells().map((cell) => {
                  const meta = cell.column.columnDef.meta;
                  const header = cell.column.columnDef.header;
                  const label = meta?.cellLabel ?? (typeof header === 'string' ? header : '');
                  return (
                    <td
                      key={cell.id}
                      data-label={meta?.hideCellLabel ? undefined : label}
                      className="px-2 py-2 align-middle max-sm:flex max-sm:min-h-9 max-sm:[&:has(>div:empty)]:hidden max-sm:flex-wrap max-sm:items-center max-sm:justify-between max-sm:gap-x-3 max-sm:px-0 max-sm:py-1 max-sm:before:text-sm max-sm:before:font-semibold max-sm:before:text-ink-muted max-sm:before:content-[attr(data-label)]"
                    >
                      {/* A long value (an e-mail) drops below its label on a phone before it breaks mid-word. */}
                      <div className="max-w-full min-w-0 [overflow-wrap:break-word] max-sm:grow max-sm:text-right">
                        <table.FlexRender cell={cell} />
                      </div>
                    </td>
                  );
                })}
              </tr>
            ))
          )}
        </tbody>
      </table>

      {pageCount > 1 ? (
        <nav aria-label={`Pages of ${itemsLabel}`} className="flex items-center justify-between gap-2">
          <Button variant="secondary" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
            Previous
          </Button>
          <span className="text-sm text-ink-muted">
            Page {pageIndex + 1} of {pageCount}
          </span>
          <Button variant="secondary" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
            Next
          </Button>
        </nav>
      ) : null}
    </div>
  );
}

