import { useEffect, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import { inspectionStateLabels, inspectionStates } from '@heatfleet/domain';
import { DataTable } from '@/components/ui/data-table';
import { Button } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { SelectField } from '@/components/ui/select-field';
import { itemKindQueries, kitItemQueries, type KitItemFilters } from '@/features/kits/api/kit-queries';
import { kitItemColumns } from '@/features/kits/components/kit-item-columns';

const PAGE_SIZE = 25;
const initialSorting = [{ id: 'assetTag', desc: false }];
// Table column -> the API's sort key; a column the server cannot sort by falls back to the asset tag.
const serverSortKeys: Record<string, NonNullable<KitItemFilters['sort']>> = {
  assetTag: 'assetTag',
  kind: 'kind',
  kit: 'kit',
  where: 'location',
  due: 'due',
};
const columnOfSortKey = Object.fromEntries(Object.entries(serverSortKeys).map(([column, key]) => [key, column]));

export interface PlaceOption {
  id: number;
  label: string;
}

function positiveInt(value: string | null): number | undefined {
  const n = Number(value);
  return Number.isInteger(n) && n > 0 ? n : undefined;
}

function readFilters(params: URLSearchParams): KitItemFilters {
  const state = params.get('due');
  return {
    kindId: positiveInt(params.get('kind')),
    locationId: positiveInt(params.get('place')),
    inspectionState: inspectionStates.find((s) => s === state),
    q: params.get('q') ?? undefined,
    sort: Object.values(serverSortKeys).find((k) => k === params.get('sort')),
    dir: params.get('dir') === 'desc' ? 'desc' : undefined,
    page: positiveInt(params.get('page')) ?? 1,
    pageSize: PAGE_SIZE,
  };
}

/** Every item of the firm, filtered and paged by the server; the filters live in the URL so a link keeps them. */
export function KitItemsTable({ places }: { places: PlaceOption[] }) {
  const [params, setParams] = useSearchParams();
  const filters = readFilters(params);
  const [text, setText] = useState(filters.q ?? '');
  const kinds = useQuery(itemKindQueries.list());
  const items = useQuery(kitItemQueries.list(filters));

  const update = (changes: Record<string, string | undefined>) =>
    setParams(
      (current) => {
        const next = new URLSearchParams(current);
        for (const [key, value] of Object.entries(changes)) {
          if (value) next.set(key, value);
          else next.delete(key);
        }
        // A new filter starts again at its first page.
        if (!('page' in changes)) next.delete('page');
        return next;
      },
      { replace: true },
    );

  // Typing waits for a pause before asking the server, so each key press is not a request.
  useEffect(() => {
    if (text === (filters.q ?? '')) return;
    const timer = setTimeout(() => update({ q: text.trim() || undefined }), 300);
    return () => clearTimeout(timer);
  });

  const toolbar = (
    <div className="grid gap-3 sm:grid-cols-3">
      <SelectField
        label="Kind"
        value={filters.kindId ? String(filters.kindId) : ''}
        onChange={(event) => update({ kind: event.target.value })}
        options={[
          { value: '', label: 'All kinds' },
          ...(kinds.data ?? []).map((k) => ({ value: String(k.id), label: k.name })),
        ]}
      />
      <SelectField
        label="Where"
        value={filters.locationId ? String(filters.locationId) : ''}
        onChange={(event) => update({ place: event.target.value })}
        options={[{ value: '', label: 'Anywhere' }, ...places.map((p) => ({ value: String(p.id), label: p.label }))]}
      />
      <SelectField
        label="Inspection"
        value={filters.inspectionState ?? ''}
        onChange={(event) => update({ due: event.target.value })}
        options={[
          { value: '', label: 'Any state' },
          ...inspectionStates.map((s) => ({ value: s, label: inspectionStateLabels[s] })),
        ]}
      />
    </div>
  );

  if (items.isPending) return <PageSpinner label="Loading items…" />;
  if (items.isError) {
    // The filters stay on screen, so a filter the server could not answer can be changed back.
    return (
      <div className="space-y-3">
        {toolbar}
        <QueryErrorNotice error={items.error} onRetry={() => void items.refetch()} />
        <Button
          variant="secondary"
          onClick={() => {
            setText('');
            setParams(new URLSearchParams(), { replace: true });
          }}
        >
          Clear the filters
        </Button>
      </div>
    );
  }
  const page = items.data;

  return (
    <DataTable
      columns={kitItemColumns}
      data={page.items}
      getRowId={(item) => String(item.id)}
      caption="Kit items"
      filterLabel="Find by asset tag or serial number"
      itemsLabel="items"
      emptyMessage="No items match these filters."
      pageSize={PAGE_SIZE}
      initialSorting={initialSorting}
      toolbar={toolbar}
      server={{
        sorting: [{ id: columnOfSortKey[filters.sort ?? 'assetTag'] ?? 'assetTag', desc: filters.dir === 'desc' }],
        onSortingChange: (sorting) => {
          const first = sorting[0];
          update({
            sort: first ? (serverSortKeys[first.id] ?? 'assetTag') : undefined,
            dir: first?.desc ? 'desc' : undefined,
          });
        },
        rowCount: page.total,
        pageIndex: filters.page - 1,
        onPageChange: (pageIndex) => update({ page: pageIndex > 0 ? String(pageIndex + 1) : undefined }),
        filter: text,
        onFilterChange: setText,
        isFetching: items.isPlaceholderData,
      }}
    />
  );
}
