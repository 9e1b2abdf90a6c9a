import { useId } from 'react';
import { Button } from '@/components/ui/button';
import type { DataTableInstance } from '@/components/ui/data-table-columns';

export function DataTableFilter({
  label,
  value,
  onChange,
}: {
  label: string;
  value: string;
  onChange: (value: string) => void;
}) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1 sm:max-w-sm">
      <label htmlFor={id} className="text-sm font-semibold">
        {label}
      </label>
      <input
        id={id}
        type="search"
        value={value}
        onChange={(event) => onChange(event.target.value)}
        className="min-h-12 rounded-md border border-line-strong bg-card px-3 text-base"
        autoComplete="off"
      />
    </div>
  );
}

/** On a phone the rows stack as cards and the header row is hidden, so sorting gets its own controls. */
export function DataTableSortControls<TData extends object>({ table }: { table: DataTableInstance<TData> }) {
  const id = useId();
  const activeSort = table.state.sorting[0];
  const sortable = table
    .getAllLeafColumns()
    .filter((column) => column.getCanSort())
    .map((column) => {
      const { header, meta } = column.columnDef;
      return { id: column.id, label: meta?.cellLabel ?? (typeof header === 'string' ? header : column.id) };
    });
  if (sortable.length === 0) return null;
  return (
    <div className="flex items-end gap-2 sm:hidden">
      <div className="flex min-w-0 flex-1 flex-col gap-1">
        <label htmlFor={id} className="text-sm font-semibold">
          Sort by
        </label>
        <select
          id={id}
          value={activeSort?.id ?? ''}
          onChange={(event) => table.setSorting([{ id: event.target.value, desc: activeSort?.desc ?? false }])}
          className="min-h-12 w-full rounded-md border border-line-strong bg-card px-3 text-base"
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
        className="min-h-12"
        disabled={!activeSort}
        onClick={() => activeSort && table.setSorting([{ id: activeSort.id, desc: !activeSort.desc }])}
      >
        {activeSort?.desc ? 'Descending' : 'Ascending'}
      </Button>
    </div>
  );
}
