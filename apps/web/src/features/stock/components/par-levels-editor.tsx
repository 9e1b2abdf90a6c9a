import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { parLevelInputSchema, type StockPlace } from '@heatfleet/domain';
import { Button } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/lib/form';
import { stockQueries } from '@/features/stock/api/stock-queries';
import { useSetParLevel } from '@/features/stock/api/use-save-product';
import { placeLabel, useStockChoices } from '@/features/stock/api/use-stock-choices';

const fields = ['minimum', 'target'] as const;

function ParLevelRow({
  place,
  productId,
  current,
}: {
  place: StockPlace;
  productId: number;
  current: { minimum: number; target: number } | undefined;
}) {
  const save = useSetParLevel();
  const [saved, setSaved] = useState(false);
  const form = useSchemaForm(parLevelInputSchema, fields, (values) => ({
    locationId: place.id,
    productId,
    minimum: values.minimum?.trim() ? Number(values.minimum) : undefined,
    target: values.target?.trim() ? Number(values.target) : undefined,
  }));
  const label = placeLabel(place);
  return (
    <li>
      <form
        ref={form.formRef}
        noValidate
        aria-label={`Par level at ${label}`}
        className="grid grid-cols-2 items-end gap-2 py-3 sm:grid-cols-[2fr_1fr_1fr_auto]"
        onSubmit={form.handleSubmit((input) => {
          setSaved(false);
          save.mutate(input, { onSuccess: () => setSaved(true), onError: form.showError });
        })}
      >
        <p className="col-span-2 font-semibold sm:col-span-1 sm:self-center">
          {label}
          {current ? null : <span className="block text-sm font-normal text-ink-muted">No level set</span>}
        </p>
        <TextField
          label="Minimum"
          name="minimum"
          type="number"
          inputMode="numeric"
          min={0}
          step={1}
          defaultValue={current ? String(current.minimum) : ''}
          error={form.fieldErrors.minimum}
        />
        <TextField
          label="Target"
          name="target"
          type="number"
          inputMode="numeric"
          min={0}
          step={1}
          defaultValue={current ? String(current.target) : ''}
          error={form.fieldErrors.target}
        />
        <Button type="submit" variant="secondary" busy={save.isPending} className="col-span-2 sm:col-span-1">
          {saved ? 'Saved' : 'Save'}
          <span className="sr-only"> the level at {label}</span>
        </Button>
        {form.formError ? (
          <p className="col-span-2 text-sm font-semibold text-danger-700 sm:col-span-4">{form.formError}</p>
        ) : null}
      </form>
    </li>
  );
}

/** Minimum and target packs of one product at each place: what the restock run and the reminders work from. */
export function ParLevelsEditor({ productId }: { productId: number }) {
  const choices = useStockChoices();
  const levels = useQuery(stockQueries.parLevels());
  if (choices.isPending || levels.isPending) return <PageSpinner label="Loading par levels…" />;
  if (levels.isError) return <QueryErrorNotice error={levels.error} onRetry={() => void levels.refetch()} />;
  if (choices.error) return <QueryErrorNotice error={choices.error} onRetry={() => void choices.retry()} />;
  const byPlace = new Map(levels.data.filter((l) => l.productId === productId).map((l) => [l.locationId, l]));
  return (
    <ul className="divide-y divide-line" aria-label="Par levels by place">
      {choices.places.map((place) => (
        <ParLevelRow key={place.id} place={place} productId={productId} current={byPlace.get(place.id)} />
      ))}
    </ul>
  );
}
