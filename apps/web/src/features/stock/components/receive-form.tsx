import { useMemo, useState } from 'react';
import {
  receiptInputSchema,
  type ApiErrorDetail,
  type ReceiptInput,
  type Product,
  type StockPlace,
} from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { isApiError } from '@/lib/api-client';
import { useSchemaForm } from '@/lib/form';
import { useIdempotencyKey } from '@/lib/idempotency';
import { placeLabel } from '@/features/stock/api/use-stock-choices';
import { useStockMovement } from '@/features/stock/api/use-stock-movement';
import { packsText } from '@/features/stock/components/stock-health';

const lineFields = ['productId', 'lotNumber', 'expiresOn', 'quantity'] as const;

function prepare(lineKeys: number[]) {
  return (values: Record<string, string | undefined>) => ({
    locationId: values.locationId ? Number(values.locationId) : undefined,
    reference: values.reference ?? '',
    lines: lineKeys.map((_, i) => ({
      productId: values[`lines.${i}.productId`] ? Number(values[`lines.${i}.productId`]) : undefined,
      lotNumber: values[`lines.${i}.lotNumber`] ?? '',
      expiresOn: values[`lines.${i}.expiresOn`] || undefined,
      quantity: values[`lines.${i}.quantity`] ? Number(values[`lines.${i}.quantity`]) : undefined,
    })),
  });
}

/** A delivery at the depot: one line per product and lot, each with its expiry and the packs that came. */
export function ReceiveForm({ depots, products }: { depots: StockPlace[]; products: Product[] }) {
  const [lineKeys, setLineKeys] = useState<number[]>([1]);
  const [nextKey, setNextKey] = useState(2);
  const [done, setDone] = useState<string | null>(null);
  // A lot with less than its product's minimum life left: the server asked, the person confirms.
  const [shortLife, setShortLife] = useState<{ input: ReceiptInput; lots: ApiErrorDetail[] } | null>(null);
  const movement = useStockMovement();
  const idempotency = useIdempotencyKey();
  const fields = useMemo(
    () => ['locationId', 'reference', 'lines', ...lineKeys.flatMap((_, i) => lineFields.map((f) => `lines.${i}.${f}`))],
    [lineKeys],
  );
  const prepareValues = useMemo(() => prepare(lineKeys), [lineKeys]);
  const form = useSchemaForm(receiptInputSchema, fields, prepareValues);
  const productOptions = [
    { value: '', label: 'Choose a product…' },
    ...products.map((p) => ({ value: String(p.id), label: p.name })),
  ];

  const send = (input: ReceiptInput) => {
    setDone(null);
    setShortLife(null);
    const request = { action: 'receipts' as const, input };
    movement.mutate(
      { request, idempotencyKey: idempotency.keyFor(request) },
      {
        onSuccess: () => {
          idempotency.done();
          const total = input.lines.reduce((n, l) => n + l.quantity, 0);
          setDone(`Received ${packsText(total)} on ${input.lines.length} line${input.lines.length === 1 ? '' : 's'}.`);
          form.formRef.current?.reset();
          setLineKeys([nextKey]);
          setNextKey((k) => k + 1);
        },
        onError: (error) => {
          if (isApiError(error) && error.code === 'ShortShelfLife') {
            form.clearErrors();
            setShortLife({ input, lots: error.details });
            return;
          }
          form.showError(error);
        },
      },
    );
  };

  return (
    <form
      ref={form.formRef}
      noValidate
      aria-label="Receive a delivery"
      className="space-y-4"
      onSubmit={form.handleSubmit((input) => send(input))}
    >
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField
          label="Depot"
          name="locationId"
          defaultValue={depots.length === 1 ? String(depots[0]!.id) : ''}
          options={[
            ...(depots.length === 1 ? [] : [{ value: '', label: 'Choose a depot…' }]),
            ...depots.map((d) => ({ value: String(d.id), label: placeLabel(d) })),
          ]}
          error={form.fieldErrors.locationId}
        />
        <TextField
          label="Delivery note or order reference (optional)"
          name="reference"
          maxLength={100}
          error={form.fieldErrors.reference}
        />
      </div>
      <ol className="space-y-3" aria-label="Delivery lines">
        {lineKeys.map((key, i) => (
          <li key={key} className="rounded-lg border border-line bg-canvas p-3">
            <fieldset className="grid gap-3 sm:grid-cols-[2fr_1fr_1fr_1fr]">
              <legend className="mb-1 font-semibold">Line {i + 1}</legend>
              <SelectField
                label="Product"
                name={`lines.${i}.productId`}
                defaultValue=""
                options={productOptions}
                error={form.fieldErrors[`lines.${i}.productId`]}
              />
              <TextField
                label="Lot number"
                name={`lines.${i}.lotNumber`}
                maxLength={60}
                autoComplete="off"
                error={form.fieldErrors[`lines.${i}.lotNumber`]}
              />
              <TextField
                label="Use by"
                name={`lines.${i}.expiresOn`}
                type="date"
                error={form.fieldErrors[`lines.${i}.expiresOn`]}
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
      {form.fieldErrors.lines ? (
        <p className="text-sm font-semibold text-danger-700">{form.fieldErrors.lines}</p>
      ) : null}
      {/* Adding a line sits with the lines; receiving sits apart, below a rule, so one cannot be tapped for the other. */}
      <Button
        variant="secondary"
        onClick={() => {
          setLineKeys((keys) => [...keys, nextKey]);
          setNextKey((k) => k + 1);
        }}
      >
        Add a line
      </Button>
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      {done ? <Alert tone="success">{done}</Alert> : null}
      {shortLife ? (
        <section
          aria-label="Short shelf life"
          className="space-y-3 rounded-lg border-2 border-ember-700 bg-ember-100 p-3"
        >
          <p className="font-semibold">Less use left than this product should have:</p>
          <ul className="list-disc pl-5">
            {shortLife.lots.map((lot) => (
              <li key={lot.path}>{lot.message}</li>
            ))}
          </ul>
          <p>Receive it anyway only if it will be used before it expires; otherwise send it back to the supplier.</p>
          <div className="flex flex-col gap-2 sm:flex-row">
            <Button
              busy={movement.isPending}
              onClick={() => send({ ...shortLife.input, confirmShortLife: true })}
              className="min-h-12"
            >
              Receive it anyway
            </Button>
            <Button variant="secondary" className="min-h-12" onClick={() => setShortLife(null)}>
              Go back and change it
            </Button>
          </div>
        </section>
      ) : null}
      <div className="mt-8 border-t-2 border-line pt-6">
        <Button type="submit" busy={movement.isPending} className="min-h-14 w-full text-lg sm:w-auto sm:min-w-48">
          Receive delivery
        </Button>
      </div>
    </form>
  );
}
