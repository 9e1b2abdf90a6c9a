import { useMemo, useState } from 'react';
import { transferInputSchema, type Product, type StockPlace } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/lib/form';
import { useIdempotencyKey } from '@/lib/idempotency';
import { placeLabel } from '@/features/stock/api/use-stock-choices';
import { useStockMovement } from '@/features/stock/api/use-stock-movement';
import { packsText } from '@/features/stock/components/stock-health';

/** Depot to van, van to van or van to depot; the server takes each line first expiry first. */
export function TransferForm({ places, products }: { places: StockPlace[]; products: Product[] }) {
  const [lineKeys, setLineKeys] = useState<number[]>([1]);
  const [nextKey, setNextKey] = useState(2);
  const [done, setDone] = useState<string | null>(null);
  const movement = useStockMovement();
  const idempotency = useIdempotencyKey();
  const fields = useMemo(
    () => [
      'fromLocationId',
      'toLocationId',
      'note',
      'lines',
      ...lineKeys.flatMap((_, i) => [`lines.${i}.productId`, `lines.${i}.quantity`]),
    ],
    [lineKeys],
  );
  const prepare = useMemo(
    () => (values: Record<string, string | undefined>) => ({
      fromLocationId: values.fromLocationId ? Number(values.fromLocationId) : undefined,
      toLocationId: values.toLocationId ? Number(values.toLocationId) : undefined,
      note: values.note ?? '',
      lines: lineKeys.map((_, i) => ({
        productId: values[`lines.${i}.productId`] ? Number(values[`lines.${i}.productId`]) : undefined,
        quantity: values[`lines.${i}.quantity`] ? Number(values[`lines.${i}.quantity`]) : undefined,
      })),
    }),
    [lineKeys],
  );
  const form = useSchemaForm(transferInputSchema, fields, prepare);
  const placeOptions = [
    { value: '', label: 'Choose a place…' },
    ...places.map((p) => ({ value: String(p.id), label: placeLabel(p) })),
  ];
  const productOptions = [
    { value: '', label: 'Choose a product…' },
    ...products.map((p) => ({ value: String(p.id), label: p.name })),
  ];

  return (
    <form
      ref={form.formRef}
      noValidate
      aria-label="Transfer stock"
      className="space-y-4"
      onSubmit={form.handleSubmit((input) => {
        setDone(null);
        const request = { action: 'transfers' as const, input };
        movement.mutate(
          { request, idempotencyKey: idempotency.keyFor(request) },
          {
            onSuccess: () => {
              idempotency.done();
              const to = places.find((p) => p.id === input.toLocationId);
              setDone(
                `Moved ${packsText(input.lines.reduce((n, l) => n + l.quantity, 0))} to ${to ? to.name : 'the other place'}.`,
              );
              form.formRef.current?.reset();
            },
            onError: form.showError,
          },
        );
      })}
    >
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField
          label="From"
          name="fromLocationId"
          defaultValue=""
          options={placeOptions}
          error={form.fieldErrors.fromLocationId}
        />
        <SelectField
          label="To"
          name="toLocationId"
          defaultValue=""
          options={placeOptions}
          error={form.fieldErrors.toLocationId}
        />
      </div>
      <ol className="space-y-3" aria-label="Transfer lines">
        {lineKeys.map((key, i) => (
          <li key={key} className="rounded-lg border border-line bg-canvas p-3">
            <fieldset className="grid gap-3 sm:grid-cols-[2fr_1fr]">
              <legend className="mb-1 font-semibold">Line {i + 1}</legend>
              <SelectField
                label="Product"
                name={`lines.${i}.productId`}
                defaultValue=""
                options={productOptions}
                error={form.fieldErrors[`lines.${i}.productId`]}
              />
              <TextField
                label="Quantity (packs)"
                name={`lines.${i}.quantity`}
                type="number"
                inputMode="numeric"
                min={1}
                step={1}
                error={form.fieldErrors[`lines.${i}.quantity`]}
              />
            </fieldset>
            {lineKeys.length > 1 ? (
              <Button
                variant="quiet"
                className="mt-1 px-0"
                onClick={() => setLineKeys((keys) => keys.filter((k) => k !== key))}
              >
                Remove line {i + 1}
              </Button>
            ) : null}
          </li>
        ))}
      </ol>
      <Button
        variant="secondary"
        onClick={() => {
          setLineKeys((keys) => [...keys, nextKey]);
          setNextKey((k) => k + 1);
        }}
      >
        Add a line
      </Button>
      <TextField label="Note (optional)" name="note" maxLength={300} error={form.fieldErrors.note} />
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      {done ? <Alert tone="success">{done}</Alert> : null}
      <Button type="submit" busy={movement.isPending} className="min-h-14 w-full text-lg sm:w-auto sm:min-w-48">
        Transfer
      </Button>
    </form>
  );
}
