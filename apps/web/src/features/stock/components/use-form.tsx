import { useState } from 'react';
import { usageInputSchema, type Product, type StockPlace } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/lib/form';
import { useIdempotencyKey } from '@/lib/idempotency';
import { placeLabel } from '@/features/stock/api/use-stock-choices';
import { useStockMovement } from '@/features/stock/api/use-stock-movement';
import { packsText } from '@/features/stock/components/stock-health';

const fields = ['locationId', 'productId', 'quantity', 'reason'] as const;

function prepare(values: Record<string, string | undefined>) {
  return {
    locationId: values.locationId ? Number(values.locationId) : undefined,
    productId: values.productId ? Number(values.productId) : undefined,
    quantity: values.quantity ? Number(values.quantity) : undefined,
    reason: values.reason ?? '',
  };
}

/** Stock used outside a job (a job's chemicals come off with the job), taken first expiry first. */
export function UseForm({
  places,
  products,
  defaultPlaceId,
}: {
  places: StockPlace[];
  products: Product[];
  defaultPlaceId?: number | undefined;
}) {
  const [done, setDone] = useState<string | null>(null);
  const movement = useStockMovement();
  const idempotency = useIdempotencyKey();
  const form = useSchemaForm(usageInputSchema, fields, prepare);
  const onlyOne = places.length === 1;
  return (
    <form
      ref={form.formRef}
      noValidate
      aria-label="Record stock used"
      className="space-y-4"
      onSubmit={form.handleSubmit((input) => {
        setDone(null);
        const request = { action: 'usages' as const, input };
        movement.mutate(
          { request, idempotencyKey: idempotency.keyFor(request) },
          {
            onSuccess: () => {
              idempotency.done();
              const product = products.find((p) => p.id === input.productId);
              setDone(`Recorded ${packsText(input.quantity)} of ${product?.name ?? 'the product'} used.`);
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
          name="locationId"
          defaultValue={defaultPlaceId !== undefined ? String(defaultPlaceId) : onlyOne ? String(places[0]!.id) : ''}
          options={[
            ...(onlyOne ? [] : [{ value: '', label: 'Choose a place…' }]),
            ...places.map((p) => ({ value: String(p.id), label: placeLabel(p) })),
          ]}
          error={form.fieldErrors.locationId}
        />
        <SelectField
          label="Product"
          name="productId"
          defaultValue=""
          options={[
            { value: '', label: 'Choose a product…' },
            ...products.map((p) => ({ value: String(p.id), label: p.name })),
          ]}
          error={form.fieldErrors.productId}
        />
        <TextField
          label="Quantity (packs)"
          name="quantity"
          type="number"
          inputMode="numeric"
          min={1}
          step={1}
          error={form.fieldErrors.quantity}
        />
        <TextField label="What it was used for" name="reason" maxLength={300} error={form.fieldErrors.reason} />
      </div>
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      {done ? <Alert tone="success">{done}</Alert> : null}
      <Button type="submit" busy={movement.isPending} className="min-h-14 w-full text-lg sm:w-auto sm:min-w-48">
        Record use
      </Button>
    </form>
  );
}
