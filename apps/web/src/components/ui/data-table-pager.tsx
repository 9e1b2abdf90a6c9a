import { Button } from '@/components/ui/button';
import type { DataTableInstance } from '@/components/ui/data-table-columns';

/** "Showing 11–20 of 45 members": which rows of how many, announced as it changes. */
export function DataTableCount({
  matching,
  first,
  last,
  itemsLabel,
  filter,
  isFetching,
}: {
  matching: number;
  first: number;
  last: number;
  itemsLabel: string;
  filter: string;
  isFetching?: boolean;
}) {
  return (
    <p className="text-sm text-ink-muted" aria-live="polite" aria-busy={isFetching || undefined}>
      {isFetching ? 'Loading… ' : null}
      {matching === 0
        ? `No ${itemsLabel} to show.`
        : `Showing ${first}–${last} of ${matching} ${itemsLabel}${filter ? ` matching "${filter}"` : ''}.`}
    </p>
  );
}

/** Previous and next, shown only when there is more than one page. */
export function DataTablePager<TData extends object>({
  table,
  itemsLabel,
}: {
  table: DataTableInstance<TData>;
  itemsLabel: string;
}) {
  const pageCount = Math.max(1, table.getPageCount());
  if (pageCount <= 1) return null;
  return (
    <nav aria-label={`Pages of ${itemsLabel}`} className="flex items-center justify-between gap-2">
      <Button
        variant="secondary"
        className="min-h-12"
        onClick={() => table.previousPage()}
        disabled={!table.getCanPreviousPage()}
      >
        Previous
      </Button>
      <span className="text-sm text-ink-muted">
        Page {table.state.pagination.pageIndex + 1} of {pageCount}
      </span>
      <Button
        variant="secondary"
        className="min-h-12"
        onClick={() => table.nextPage()}
        disabled={!table.getCanNextPage()}
      >
        Next
      </Button>
    </nav>
  );
}
