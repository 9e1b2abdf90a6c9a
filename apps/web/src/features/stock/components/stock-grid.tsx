import { useMemo, useState } from 'react';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { formatPackSize, formatPacks, stockHealthLabels, type StockCell } from '@heatfleet/domain';
import { Button } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { stockQueries } from '@/features/stock/api/stock-queries';
import { BatchList } from '@/features/stock/components/batch-list';
import { HealthLegend, healthStyles } from '@/features/stock/components/stock-health';

interface Selected {
  locationId: number;
  productId: number;
}

/** Previous and next page of places, 48 px targets, shown only when the places run over one page. */
function PlacePager({
  page,
  pageCount,
  first,
  last,
  placeCount,
  isFetching,
  onPage,
}: {
  page: number;
  pageCount: number;
  first: number;
  last: number;
  placeCount: number;
  isFetching: boolean;
  onPage: (page: number) => void;
}) {
  if (pageCount <= 1) return null;
  return (
    <nav aria-label="Pages of places" className="flex flex-wrap items-center justify-between gap-2">
      <Button variant="secondary" className="min-h-12" onClick={() => onPage(page - 1)} disabled={page <= 1}>
        Previous places
      </Button>
      <span className="text-center text-sm text-ink-muted" aria-live="polite" aria-busy={isFetching || undefined}>
        {isFetching ? 'Loading… ' : null}Places {first}–{last} of {placeCount}
      </span>
      <Button variant="secondary" className="min-h-12" onClick={() => onPage(page + 1)} disabled={page >= pageCount}>
        Next places
      </Button>
    </nav>
  );
}

/**
 * Products down, places across, a page of places at a time (the API pages the grid by place, 20 a page):
 * each cell the usable packs, coloured by health against par; a cell opens its batches. Each product's
 * own cell also gives its usable packs over every place.
 */
export function StockGridView() {
  const [page, setPage] = useState(1);
  const grid = useQuery({ ...stockQueries.grid(page), placeholderData: keepPreviousData });
  const [selected, setSelected] = useState<Selected | null>(null);
  const cells = useMemo(() => {
    const map = new Map<string, StockCell>();
    for (const cell of grid.data?.cells ?? []) map.set(`${cell.locationId}:${cell.productId}`, cell);
    return map;
  }, [grid.data]);
  const totals = useMemo(() => new Map((grid.data?.totals ?? []).map((t) => [t.productId, t])), [grid.data]);

  if (grid.isPending) return <PageSpinner label="Loading stock…" />;
  if (grid.isError) return <QueryErrorNotice error={grid.error} onRetry={() => void grid.refetch()} />;
  const { products, locations } = grid.data;
  if (products.length === 0) return <p className="text-ink-muted">No products yet. Add one under Products first.</p>;

  const selectedProduct = selected ? products.find((p) => p.id === selected.productId) : undefined;
  const selectedPlace = selected ? locations.find((l) => l.id === selected.locationId) : undefined;
  const shown = grid.data.page;
  const first = (shown.page - 1) * shown.limit + 1;
  return (
    <div className="space-y-4">
      <HealthLegend />
      <PlacePager
        page={shown.page}
        pageCount={shown.pageCount}
        first={first}
        last={first + locations.length - 1}
        placeCount={shown.placeCount}
        isFetching={grid.isPlaceholderData}
        onPage={(next) => {
          setSelected(null);
          setPage(next);
        }}
      />
      {/* The grid scrolls inside its own box on a phone, so the page itself never runs wider than the screen. */}
      <div
        className="max-w-full overflow-x-auto rounded-lg border border-line"
        tabIndex={0}
        role="region"
        aria-label="Stock grid, scrolls sideways"
      >
        <table className="min-w-full border-collapse text-left">
          <caption className="sr-only">Usable packs of each product at each place</caption>
          <thead>
            <tr>
              <th
                scope="col"
                className="sticky left-0 z-[1] border-b-2 border-line bg-card px-2 py-2 text-sm font-semibold text-ink-muted"
              >
                Product
              </th>
              {locations.map((place) => (
                <th
                  key={place.id}
                  scope="col"
                  className="border-b-2 border-line px-2 py-2 text-sm font-semibold whitespace-nowrap text-ink-muted"
                >
                  {place.name}
                  {place.kind === 'depot' ? (
                    <span className="block text-xs font-normal">Depot</span>
                  ) : place.registration ? (
                    <span className="block font-mono text-xs font-normal">{place.registration}</span>
                  ) : null}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {products.map((product) => (
              <tr key={product.id} className="border-b border-line">
                <th
                  scope="row"
                  className="sticky left-0 z-[1] max-w-36 bg-card min-w-28 px-2 py-1 text-sm font-semibold hyphens-auto [overflow-wrap:break-word] sm:max-w-none"
                >
                  {product.name}
                  <span className="block text-xs font-normal text-ink-muted">
                    packs of {formatPackSize(product.packSizeMl)}
                  </span>
                  {/* Over every place, not only this page's: the API adds them up. */}
                  <span className="block text-xs font-normal text-ink-muted">
                    {totals.get(product.id)?.usable ?? 0} usable in all
                  </span>
                </th>
                {locations.map((place) => {
                  const cell = cells.get(`${place.id}:${product.id}`);
                  const health = cell?.health ?? 'no_par';
                  const usable = cell?.usable ?? 0;
                  const isSelected = selected?.locationId === place.id && selected.productId === product.id;
                  // Named by its content (visible figures plus words for screen readers), so the name always
                  // holds what is seen (WCAG 2.2 SC 2.5.3, label in name).
                  const detail = `${formatPacks(usable, product.packSizeMl)} usable, ${stockHealthLabels[health]}${cell?.need ? `, minimum ${cell.need.minimum}, target ${cell.need.target}` : ''}${cell?.booked ? `, ${cell.booked} booked` : ''}${cell?.expired ? `, ${cell.expired} expired` : ''}`;
                  return (
                    <td key={place.id} className="px-1 py-1">
                      <button
                        type="button"
                        aria-pressed={isSelected}
                        onClick={() => setSelected(isSelected ? null : { locationId: place.id, productId: product.id })}
                        className={`flex min-h-12 w-full min-w-16 flex-col items-center justify-center rounded-md border px-2 font-semibold ${healthStyles[health].cell} ${isSelected ? 'ring-3 ring-brand-700' : ''}`}
                      >
                        <span className="sr-only">
                          {product.name} at {place.name}: ({detail}){' '}
                        </span>
                        <span className="text-lg leading-tight">
                          <span aria-hidden="true" className="mr-1 text-xs">
                            {healthStyles[health].mark}
                          </span>
                          {usable}
                        </span>
                        {cell?.need ? <span className="text-xs font-normal">of {cell.need.target}</span> : null}
                        {cell?.booked ? <span className="text-xs font-normal">{cell.booked} booked</span> : null}
                        {cell?.expired ? <span className="text-xs font-normal">+{cell.expired} expired</span> : null}
                      </button>
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {selected && selectedProduct && selectedPlace ? (
        <section aria-label="Batches" className="rounded-lg border border-line bg-canvas p-3">
          <h3 className="font-bold text-brand-900">
            {selectedProduct.name} at {selectedPlace.name}
          </h3>
          <BatchList locationId={selected.locationId} productId={selected.productId} today={grid.data.today} />
        </section>
      ) : (
        <p className="text-sm text-ink-muted">Choose a cell to see its batches, lot by lot.</p>
      )}
    </div>
  );
}
