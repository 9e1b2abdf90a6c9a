import { useState } from 'react';
import { useLocation } from 'react-router-dom';
import { usageInputSchema, type Product, type StockPlace } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useSignedInMe } from '@/lib/auth';
import { useSchemaForm } from '@/lib/form';
import { useFormDraft } from '@/lib/offline/use-form-draft';
import { queuedMessage, useQueueWrite } from '@/lib/offline/queue-write';
import { stockQueries } from '@/features/stock/api/stock-queries';
import { placeLabel } from '@/features/stock/api/use-stock-choices';
import { packsText } from '@/features/stock/components/stock-health';

const fields = ['locationId', 'productId', 'quantity', 'reason'] as const;
const DRAFT_KEY = 'stock:use';

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
  const [done, setDone] = useState<{ message: string; final: boolean } | null>(null);
  const me = useSignedInMe();
  const write = useQueueWrite();
  const href = useLocation().pathname;
  const form = useSchemaForm(usageInputSchema, fields, prepare);
  useFormDraft(form.formRef, DRAFT_KEY);
  const onlyOne = places.length === 1;
  return (
    <form
      ref={form.formRef}
      noValidate
      aria-label="Record stock used"
      className="space-y-4"
      onSubmit={form.handleSubmit(async (input) => {
        setDone(null);
        const product = products.find((p) => p.id === input.productId)?.name ?? 'the product';
        const place = places.find((p) => p.id === input.locationId)?.name ?? 'the van';
        const success = `Recorded ${packsText(input.quantity)} of ${product} used.`;
        try {
          // Through the phone's queue (lib/offline): with no signal it is kept and sent later, with its tap time.
          const outcome = await write.queue(
            {
              path: '/api/stock/usages',
              body: input,
              label: `Use ${packsText(input.quantity)} of ${product} from ${place}`,
              href,
              group: 'stock-use',
              draftKey: DRAFT_KEY,
              invalidate: [stockQueries.all()],
            },
            me,
          );
          form.formRef.current?.reset();
          if (outcome.status === 'sent') return setDone({ message: success, final: true });
          const message = queuedMessage('the stock use', outcome.why);
          setDone({ message, final: false });
          void outcome.settled.then((settled) => {
            if (settled === 'sent')
              setDone((shown) => (shown?.message === message ? { message: success, final: true } : shown));
          });
        } catch (error) {
          form.showError(error);
        }
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
      {done ? <Alert tone={done.final ? 'success' : 'info'}>{done.message}</Alert> : null}
      <Button type="submit" busy={write.isPending} className="min-h-14 w-full text-lg sm:w-auto sm:min-w-48">
        Record use
      </Button>
    </form>
  );
}
