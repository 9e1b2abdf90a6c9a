import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { createKitItemInputSchema } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { paths } from '@/config/paths';
import { textOrNull, useSchemaForm } from '@/lib/form';
import { itemKindQueries, kitQueries } from '@/features/kits/api/kit-queries';
import { useCreateKitItem } from '@/features/kits/api/use-save-kit';
import type { PlaceOption } from '@/features/kits/components/kit-items-table';

const fields = ['assetTag', 'kindId', 'kitId', 'serialNumber', 'locationId', 'notes'] as const;

function prepare(values: Record<string, string | undefined>) {
  return {
    assetTag: values.assetTag,
    kindId: values.kindId ? Number(values.kindId) : undefined,
    kitId: values.kitId ? Number(values.kitId) : null,
    serialNumber: textOrNull(values.serialNumber),
    locationId: values.locationId ? Number(values.locationId) : undefined,
    notes: textOrNull(values.notes),
  };
}

/** New items start at a depot (or a van) and from then on move only through the custody log. */
export function KitItemForm({ places }: { places: PlaceOption[] }) {
  const kinds = useQuery(itemKindQueries.list());
  const kits = useQuery(kitQueries.list());
  const create = useCreateKitItem();
  const form = useSchemaForm(createKitItemInputSchema, fields, prepare);

  return (
    <form
      ref={form.formRef}
      noValidate
      className="space-y-4"
      aria-label="New item"
      onSubmit={form.handleSubmit((input) =>
        create.mutate(input, { onError: form.showError, onSuccess: () => form.formRef.current?.reset() }),
      )}
    >
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      {create.isSuccess ? (
        <Alert tone="success">
          Item{' '}
          <Link to={paths.kitItem.getHref(create.data.id)} className="underline">
            {create.data.assetTag}
          </Link>{' '}
          added.{' '}
          <Link to={paths.labels.getHref({ ids: [create.data.id] })} className="underline">
            Print its label
          </Link>
        </Alert>
      ) : null}
      <div className="grid gap-4 sm:grid-cols-3">
        <TextField
          label="Asset tag"
          name="assetTag"
          required
          autoCapitalize="characters"
          autoComplete="off"
          error={form.fieldErrors.assetTag}
        />
        <SelectField
          label="Kind"
          name="kindId"
          defaultValue=""
          options={[
            { value: '', label: 'Choose a kind…' },
            ...(kinds.data ?? []).map((k) => ({ value: String(k.id), label: k.name })),
          ]}
          error={form.fieldErrors.kindId}
        />
        <SelectField
          label="Kit"
          name="kitId"
          defaultValue=""
          options={[
            { value: '', label: 'Loose (no kit)' },
            ...(kits.data ?? []).map((k) => ({ value: String(k.id), label: k.name })),
          ]}
          error={form.fieldErrors.kitId}
        />
        <TextField label="Serial number" name="serialNumber" autoComplete="off" error={form.fieldErrors.serialNumber} />
        <SelectField
          label="Starts at"
          name="locationId"
          defaultValue=""
          options={[
            { value: '', label: 'The main depot' },
            ...places.map((p) => ({ value: String(p.id), label: p.label })),
          ]}
          error={form.fieldErrors.locationId}
        />
        <TextField label="Notes" name="notes" autoComplete="off" error={form.fieldErrors.notes} />
      </div>
      <Button type="submit" busy={create.isPending}>
        Add item
      </Button>
    </form>
  );
}
