import { useMemo, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { stocktakeInputSchema, type BatchStockRow, type StockPlace } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { formatCalendarDate } from '@/lib/format';
import { useSchemaForm } from '@/lib/form';
import { useIdempotencyKey } from '@/lib/idempotency';
import { stockQueries } from '@/features/stock/api/stock-queries';
import { placeLabel } from '@/features/stock/api/use-stock-choices';
import { useStockMovement } from '@/features/stock/api/use-stock-movement';

function CountForm({
  locationId,
  batches,
  onDone,
}: {
  locationId: number;
  batches: BatchStockRow[];
  onDone: (message: string) => void;
}) {
  const movement = useStockMovement();
  const idempotency = useIdempotencyKey();
  const fields = useMemo(() => ['note', 'counts', ...batches.map((_, i) => `counts.${i}.counted`)], [batches]);
  const prepare = useMemo(
    () => (values: Record<string, string | undefined>) => ({
      locationId,
      note: values.note ?? '',
      counts: batches.map((row, i) => {
        const raw = values[`counts.${i}.counted`];
        return { batchId: row.batch.id, counted: raw === undefined || raw === '' ? undefined : Number(raw) };
      }),
    }),
    [batches, locationId],
  );
  const form = useSchemaForm(stocktakeInputSchema, fields, prepare);
  return (
    <form
      ref={form.formRef}
      noValidate
      aria-label="Stocktake counts"
      className="space-y-4"
      onSubmit={form.handleSubmit((input) => {
        const request = { action: 'stocktakes' as const, input };
        movement.mutate(
          { request, idempotencyKey: idempotency.keyFor(request) },
          {
            onSuccess: (answer) => {
              idempotency.done();
              const n = answer.movements.length;
              onDone(
                n === 0
                  ? 'Counted: everything matched, nothing was adjusted.'
                  : `Counted: ${n} batch${n === 1 ? '' : 'es'} adjusted to the count.`,
              );
            },
            onError: form.showError,
          },
        );
      })}
    >
      <p className="text-ink-muted">
        Count what is on the shelf for each batch; the difference from the record becomes an adjustment.
      </p>
      <ul className="space-y-2" aria-label="Batches to count">
        {batches.map((row, i) => (
          <li
            key={row.batch.id}
            className="grid items-end gap-2 rounded-lg border border-line bg-canvas p-3 sm:grid-cols-[2fr_1fr]"
          >
            <div>
              <p className="font-semibold">{row.product.name}</p>
              <p className="text-sm text-ink-muted">
                Lot <span className="font-mono">{row.batch.lotNumber}</span>, {row.expired ? 'expired' : 'use by'}{' '}
                {formatCalendarDate(row.batch.expiresOn)}; recorded {row.quantity}
              </p>
            </div>
            <TextField
              label={`Counted, lot ${row.batch.lotNumber}`}
              name={`counts.${i}.counted`}
              type="number"
              inputMode="numeric"
              min={0}
              step={1}
              defaultValue={String(row.quantity)}
              error={form.fieldErrors[`counts.${i}.counted`]}
            />
          </li>
        ))}
      </ul>
      <TextField label="Note (optional)" name="note" maxLength={300} error={form.fieldErrors.note} />
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      <Button type="submit" busy={movement.isPending} className="min-h-14 w-full text-lg sm:w-auto sm:min-w-48">
        Record stocktake
      </Button>
    </form>
  );
}

/** A stocktake of one place, batch by batch. */
export function StocktakeForm({ places }: { places: StockPlace[] }) {
  const [placeId, setPlaceId] = useState<number | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const batches = useQuery({ ...stockQueries.batches({ locationId: placeId ?? 0 }), enabled: placeId !== null });
  return (
    <div className="space-y-4">
      <SelectField
        label="Place to count"
        value={placeId === null ? '' : String(placeId)}
        onChange={(event) => {
          setDone(null);
          setPlaceId(event.target.value ? Number(event.target.value) : null);
        }}
        options={[
          { value: '', label: 'Choose a place…' },
          ...places.map((p) => ({ value: String(p.id), label: placeLabel(p) })),
        ]}
      />
      {done ? <Alert tone="success">{done}</Alert> : null}
      {placeId === null ? null : batches.isPending ? (
        <PageSpinner label="Loading batches…" />
      ) : batches.isError ? (
        <QueryErrorNotice error={batches.error} onRetry={() => void batches.refetch()} />
      ) : batches.data.length === 0 ? (
        <p className="text-ink-muted">Nothing is recorded here, so there is nothing to count.</p>
      ) : (
        <CountForm
          key={`${placeId}:${batches.dataUpdatedAt}`}
          locationId={placeId}
          batches={batches.data}
          onDone={setDone}
        />
      )}
    </div>
  );
}
