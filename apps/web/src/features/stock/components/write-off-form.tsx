import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { writeOffInputSchema, writeOffReasons, type StockPlace } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { formatCalendarDate } from '@/lib/format';
import { useSchemaForm } from '@/lib/form';
import { useIdempotencyKey } from '@/lib/idempotency';
import { stockQueries } from '@/features/stock/api/stock-queries';
import { placeLabel } from '@/features/stock/api/use-stock-choices';
import { useStockMovement } from '@/features/stock/api/use-stock-movement';
import { packsText } from '@/features/stock/components/stock-health';

const fields = ['locationId', 'batchId', 'quantity', 'reason', 'note'] as const;
const reasonLabels: Record<(typeof writeOffReasons)[number], string> = {
  expired: 'Expired',
  damaged: 'Damaged',
  spilled: 'Spilled',
};

function prepare(values: Record<string, string | undefined>) {
  return {
    locationId: values.locationId ? Number(values.locationId) : undefined,
    batchId: values.batchId ? Number(values.batchId) : undefined,
    quantity: values.quantity ? Number(values.quantity) : undefined,
    reason: values.reason,
    note: values.note ?? '',
  };
}

export function WriteOffForm({ places }: { places: StockPlace[] }) {
  const [placeId, setPlaceId] = useState<number | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const batches = useQuery({ ...stockQueries.batches({ locationId: placeId ?? 0 }), enabled: placeId !== null });
  const movement = useStockMovement();
  const idempotency = useIdempotencyKey();
  const form = useSchemaForm(writeOffInputSchema, fields, prepare);
  return (
    <form
      ref={form.formRef}
      noValidate
      aria-label="Write off stock"
      className="space-y-4"
      onSubmit={form.handleSubmit((input) => {
        setDone(null);
        const request = { action: 'write-offs' as const, input };
        movement.mutate(
          { request, idempotencyKey: idempotency.keyFor(request) },
          {
            onSuccess: () => {
              idempotency.done();
              setDone(`Wrote off ${packsText(input.quantity)} (${reasonLabels[input.reason].toLowerCase()}).`);
              form.formRef.current?.reset();
              setPlaceId(null);
            },
            onError: form.showError,
          },
        );
      })}
    >
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField
          label="Place"
          name="locationId"
          value={placeId === null ? '' : String(placeId)}
          onChange={(event) => setPlaceId(event.target.value ? Number(event.target.value) : null)}
          options={[
            { value: '', label: 'Choose a place…' },
            ...places.map((p) => ({ value: String(p.id), label: placeLabel(p) })),
          ]}
          error={form.fieldErrors.locationId}
        />
        <SelectField
          label="Batch"
          name="batchId"
          defaultValue=""
          disabled={placeId === null || batches.isPending}
          options={[
            {
              value: '',
              label: placeId === null ? 'Choose the place first' : batches.isPending ? 'Loading…' : 'Choose a batch…',
            },
            ...(batches.data ?? []).map((row) => ({
              value: String(row.batch.id),
              label: `${row.product.name}, lot ${row.batch.lotNumber} (${row.expired ? 'expired' : 'use by'} ${formatCalendarDate(row.batch.expiresOn)}): ${row.quantity} held`,
            })),
          ]}
          error={form.fieldErrors.batchId}
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
      </div>
      <ChoiceGroup
        legend="Why"
        name="reason"
        options={writeOffReasons.map((r) => ({ value: r, label: reasonLabels[r] }))}
        error={form.fieldErrors.reason}
      />
      <TextField label="Note (optional)" name="note" maxLength={300} error={form.fieldErrors.note} />
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      {done ? <Alert tone="success">{done}</Alert> : null}
      <Button
        type="submit"
        variant="danger"
        busy={movement.isPending}
        className="min-h-14 w-full text-lg sm:w-auto sm:min-w-48"
      >
        Write off
      </Button>
    </form>
  );
}
