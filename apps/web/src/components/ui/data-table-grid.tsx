import type { DataTableInstance } from '@/components/ui/data-table-columns';

const sortMarks = { asc: '▲', desc: '▼' } as const;

/**
 * The rows as a table with sortable column headers; on a phone each row stacks as a card, every
 * value labelled by its column.
 */
export function DataTableGrid<TData extends object>({
  table,
  caption,
  empty,
}: {
  table: DataTableInstance<TData>;
  caption: string;
  empty: string;
}) {
  const rows = table.getRowModel().rows;
  const leafCount = table.getAllLeafColumns().length;
  return (
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
                      className={`inline-flex min-h-12 items-center gap-1 rounded-md px-1 hover:text-ink ${sorted ? 'text-ink' : ''}`}
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
              {empty}
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
                    <div className="max-w-full min-w-0 [overflow-wrap:break-word] max-sm:grow max-sm:text-right [&_a]:inline-flex [&_a]:min-h-12 [&_a]:items-center">
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
  );
}
