import { useMemo, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import {
  isLargeStocktakeChange,
  stocktakeInputSchema,
  zeroesWholePlace,
  type BatchStockRow,
  type Product,
  type StockMoved,
  type StockPlace,
  type StocktakeInput,
} from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { formatCalendarDate } from '@/lib/format';
import { useSchemaForm } from '@/lib/form';
import { useIdempotencyKey } from '@/lib/idempotency';
import { productQueries, stockQueries } from '@/features/stock/api/stock-queries';
import { placeLabel } from '@/features/stock/api/use-stock-choices';
import { useStockMovement } from '@/features/stock/api/use-stock-movement';
import { FoundLotRows, foundFields, prepareFound } from '@/features/stock/components/stocktake-found-lots';
import { StocktakeSummary, type CountedLine } from '@/features/stock/components/stocktake-summary';

interface Saved {
  answer: StockMoved;
  lines: CountedLine[];
}

function CountForm({
  place,
  batches,
  products,
  blind,
  onDone,
}: {
  place: StockPlace;
  batches: BatchStockRow[];
  products: Product[];
  blind: boolean;
  onDone: (saved: Saved) => void;
}) {
  const movement = useStockMovement();
  const idempotency = useIdempotencyKey();
  const [foundKeys, setFoundKeys] = useState<number[]>([]);
  const [confirm, setConfirm] = useState<{ input: StocktakeInput; large: CountedLine[]; zeroing: boolean } | null>(
    null,
  );
  const fields = useMemo(
    () => ['note', 'counts', ...batches.map((_, i) => `counts.${i}.counted`), ...foundFields(foundKeys)],
    [batches, foundKeys],
  );
  const prepare = useMemo(
    () => (values: Record<string, string | undefined>) => ({
      locationId: place.id,
      note: values.note ?? '',
      counts: batches.map((row, i) => {
        const raw = values[`counts.${i}.counted`];
        return { batchId: row.batch.id, counted: raw === undefined || raw === '' ? undefined : Number(raw) };
      }),
      found: prepareFound(foundKeys, values),
    }),
    [batches, foundKeys, place.id],
  );
  const form = useSchemaForm(stocktakeInputSchema, fields, prepare);
  const linesOf = (input: StocktakeInput): CountedLine[] => [
    ...batches.map((row) => ({
      key: `b${row.batch.id}`,
      product: row.product.name,
      lotNumber: row.batch.lotNumber,
      recorded: row.quantity,
      counted: input.counts.find((c) => c.batchId === row.batch.id)?.counted ?? row.quantity,
    })),
    ...input.found.map((f, i) => ({
      key: `f${i}`,
      product: products.find((p) => p.id === f.productId)?.name ?? '',
      lotNumber: f.lotNumber,
      recorded: 0,
      counted: f.counted,
    })),
  ];
  const save = (input: StocktakeInput) => {
    setConfirm(null);
    const request = { action: 'stocktakes' as const, input };
    // Awaited rather than a mutate callback: saving refreshes the batches, which remounts this form
    // before a callback of the old one could run; the parent keeps the summary.
    void movement.mutateAsync({ request, idempotencyKey: idempotency.keyFor(request) }).then((answer) => {
      idempotency.done();
      onDone({ answer, lines: linesOf(input) });
    }, form.showError);
  };
  return (
    <form
      ref={form.formRef}
      noValidate
      aria-label="Stocktake counts"
      className="space-y-4"
      onSubmit={form.handleSubmit((input) => {
        const lines = linesOf(input);
        const large = lines.filter((l) => isLargeStocktakeChange(l.recorded, l.counted));
        const counted = new Map(input.counts.map((c) => [c.batchId, c.counted]));
        const zeroing =
          input.found.length === 0 &&
          zeroesWholePlace(
            batches.map((b) => ({ batchId: b.batch.id, quantity: b.quantity })),
            counted,
          );
        if (large.length > 0 || zeroing) setConfirm({ input, large, zeroing });
        else save(input);
      })}
    >
      <p className="text-ink-muted">
        {blind
          ? 'Count what is on the shelf for each lot. The recorded figures stay hidden until the count is saved.'
          : 'Count what is on the shelf for each lot; the difference from the record becomes an adjustment.'}
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
                {formatCalendarDate(row.batch.expiresOn)}
                {blind ? '' : `; recorded ${row.quantity}`}
              </p>
            </div>
            <TextField
              label={`Counted packs, lot ${row.batch.lotNumber}`}
              name={`counts.${i}.counted`}
              type="number"
              inputMode="numeric"
              min={0}
              step={1}
              defaultValue={blind ? '' : String(row.quantity)}
              error={form.fieldErrors[`counts.${i}.counted`]}
            />
          </li>
        ))}
      </ul>
      <FoundLotRows keys={foundKeys} setKeys={setFoundKeys} products={products} errors={form.fieldErrors} />
      <TextField label="Note (optional)" name="note" maxLength={300} error={form.fieldErrors.note} />
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      {confirm ? (
        <section
          aria-label="Check the count"
          className="space-y-3 rounded-lg border-2 border-ember-700 bg-ember-100 p-3"
        >
          {confirm.zeroing ? (
            <p className="font-semibold">This count leaves {place.name} with no stock at all. Is it really empty?</p>
          ) : null}
          {confirm.large.length > 0 ? (
            <>
              <p className="font-semibold">These counts are far from the record:</p>
              <ul className="list-disc pl-5">
                {confirm.large.map((l) => (
                  <li key={l.key}>
                    {l.product}, lot {l.lotNumber}: recorded {l.recorded}, counted {l.counted}
                  </li>
                ))}
              </ul>
            </>
          ) : null}
          <div className="flex flex-col gap-2 sm:flex-row">
            <Button
              busy={movement.isPending}
              className="min-h-12"
              onClick={() => save({ ...confirm.input, ...(confirm.zeroing && { confirmZeroing: true }) })}
            >
              Yes, save the count
            </Button>
            <Button variant="secondary" className="min-h-12" onClick={() => setConfirm(null)}>
              Go back and recount
            </Button>
          </div>
        </section>
      ) : null}
      <div className="mt-8 border-t-2 border-line pt-6">
        <Button type="submit" busy={movement.isPending} className="min-h-14 w-full text-lg sm:w-auto sm:min-w-48">
          Record stocktake
        </Button>
      </div>
    </form>
  );
}

/** A stocktake of one place, lot by lot: blind by default, checked before it saves, summed up after. */
export function StocktakeForm({ places }: { places: StockPlace[] }) {
  const [placeId, setPlaceId] = useState<number | null>(null);
  const [blind, setBlind] = useState(true);
  const [saved, setSaved] = useState<Saved | null>(null);
  const batches = useQuery({ ...stockQueries.batches({ locationId: placeId ?? 0 }), enabled: placeId !== null });
  const products = useQuery(productQueries.list());
  const place = places.find((p) => p.id === placeId);
  return (
    <div className="space-y-4">
      <SelectField
        label="Place to count"
        value={placeId === null ? '' : String(placeId)}
        onChange={(event) => {
          setSaved(null);
          setPlaceId(event.target.value ? Number(event.target.value) : null);
        }}
        options={[
          { value: '', label: 'Choose a place…' },
          ...places.map((p) => ({ value: String(p.id), label: placeLabel(p) })),
        ]}
      />
      <label className="inline-flex min-h-12 cursor-pointer items-center gap-2 font-semibold">
        <input
          type="checkbox"
          className="size-6 accent-brand-700"
          checked={blind}
          onChange={(event) => setBlind(event.target.checked)}
        />
        Blind count (hide the recorded figures until it is saved)
      </label>
      {saved && place ? <StocktakeSummary place={place} answer={saved.answer} lines={saved.lines} /> : null}
      {placeId === null || !place ? null : batches.isPending || products.isPending ? (
        <PageSpinner label="Loading batches…" />
      ) : batches.isError ? (
        <QueryErrorNotice error={batches.error} onRetry={() => void batches.refetch()} />
      ) : products.isError ? (
        <QueryErrorNotice error={products.error} onRetry={() => void products.refetch()} />
      ) : (
        <>
          {batches.data.length === 0 ? (
            <p className="text-ink-muted">Nothing is recorded here. Add any lot found on the shelf below.</p>
          ) : null}
          <CountForm
            key={`${placeId}:${blind}:${batches.dataUpdatedAt}`}
            place={place}
            batches={batches.data}
            products={products.data.filter((p) => p.active)}
            blind={blind}
            onDone={setSaved}
          />
        </>
      )}
    </div>
  );
}
