import { useMemo, useState } from 'react';
import { useInfiniteQuery } from '@tanstack/react-query';
import { movementKindLabels, movementKinds, type Movement } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button, buttonClasses } from '@/components/ui/button';
import { DataTable } from '@/components/ui/data-table';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { SelectField } from '@/components/ui/select-field';
import { useAbility } from '@/lib/ability';
import { ledgerCsvHref, stockQueries, type LedgerFilters } from '@/features/stock/api/stock-queries';
import { placeLabel, useStockChoices } from '@/features/stock/api/use-stock-choices';
import { buildMovementColumns } from '@/features/stock/components/movement-columns';
import { ReverseMovementForm } from '@/features/stock/components/reverse-movement-form';

const initialSorting = [{ id: 'createdAt', desc: true }];

function DateFilter({ label, value, onChange }: { label: string; value: string; onChange: (value: string) => void }) {
  return (
    <label className="flex flex-col gap-1">
      <span className="font-semibold">{label}</span>
      <input
        type="date"
        value={value}
        onChange={(event) => onChange(event.target.value)}
        className="min-h-12 rounded-md border border-line-strong bg-card px-3 text-base"
      />
    </label>
  );
}

/** The append-only ledger, newest first, fetched a page at a time by keyset ("Older" asks for the next). */
export function LedgerView({ timeZone }: { timeZone: string }) {
  const choices = useStockChoices();
  const [filters, setFilters] = useState<LedgerFilters>({});
  const ledger = useInfiniteQuery(stockQueries.ledger(filters));
  const canReverse = useAbility().can('create', 'Stock');
  const [reversing, setReversing] = useState<Movement | null>(null);
  const [reversed, setReversed] = useState<string | null>(null);
  const columns = useMemo(
    () =>
      buildMovementColumns(
        timeZone,
        canReverse
          ? (movement) => {
              setReversed(null);
              setReversing(movement);
            }
          : undefined,
      ),
    [timeZone, canReverse],
  );
  const rows = useMemo(() => ledger.data?.pages.flatMap((page) => page.movements) ?? [], [ledger.data]);
  const set = (patch: Partial<LedgerFilters>) => setFilters((current) => ({ ...current, ...patch }));

  return (
    <div className="space-y-4">
      <fieldset className="grid gap-3 sm:grid-cols-3 lg:grid-cols-5">
        <legend className="sr-only">Filters</legend>
        <SelectField
          label="Place"
          value={filters.locationId ? String(filters.locationId) : ''}
          onChange={(event) => set({ locationId: event.target.value ? Number(event.target.value) : undefined })}
          options={[
            { value: '', label: 'All places' },
            ...choices.places.map((p) => ({ value: String(p.id), label: placeLabel(p) })),
          ]}
        />
        <SelectField
          label="Product"
          value={filters.productId ? String(filters.productId) : ''}
          onChange={(event) => set({ productId: event.target.value ? Number(event.target.value) : undefined })}
          options={[
            { value: '', label: 'All products' },
            ...choices.products.map((p) => ({ value: String(p.id), label: p.name })),
          ]}
        />
        <SelectField
          label="Kind"
          value={filters.kind ?? ''}
          onChange={(event) => set({ kind: (event.target.value || undefined) as LedgerFilters['kind'] })}
          options={[
            { value: '', label: 'Every kind' },
            ...movementKinds.map((k) => ({ value: k, label: movementKindLabels[k] })),
          ]}
        />
        <DateFilter label="From" value={filters.from ?? ''} onChange={(from) => set({ from: from || undefined })} />
        <DateFilter label="To" value={filters.to ?? ''} onChange={(to) => set({ to: to || undefined })} />
      </fieldset>
      <a href={ledgerCsvHref(filters)} download className={buttonClasses('secondary')}>
        Download these as CSV
      </a>
      {reversed ? <Alert tone="success">{reversed}</Alert> : null}
      {reversing ? (
        <ReverseMovementForm
          key={reversing.id}
          movement={reversing}
          onCancel={() => setReversing(null)}
          onDone={(message) => {
            setReversing(null);
            setReversed(message);
          }}
        />
      ) : null}
      {ledger.isPending ? (
        <PageSpinner label="Loading the ledger…" />
      ) : ledger.isError ? (
        <QueryErrorNotice error={ledger.error} onRetry={() => void ledger.refetch()} />
      ) : (
        <>
          <DataTable
            columns={columns}
            data={rows}
            getRowId={(m) => String(m.id)}
            caption="Stock movements, newest first"
            filterLabel="Find in the movements loaded"
            itemsLabel="movements loaded"
            emptyMessage="No movements match these filters."
            // Keyset paging happens on the server; everything fetched so far shows on one page.
            pageSize={100_000}
            initialSorting={initialSorting}
          />
          {ledger.hasNextPage ? (
            <Button variant="secondary" busy={ledger.isFetchingNextPage} onClick={() => void ledger.fetchNextPage()}>
              Older
            </Button>
          ) : rows.length > 0 ? (
            <p className="text-sm text-ink-muted">That is the oldest movement for these filters.</p>
          ) : null}
        </>
      )}
    </div>
  );
}
