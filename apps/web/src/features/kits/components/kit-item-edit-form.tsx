import { useQuery } from '@tanstack/react-query';
import { itemConditionLabels, itemConditions, updateKitItemInputSchema, type KitItem } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { textOrNull, useSchemaForm } from '@/lib/form';
import { itemKindQueries, kitQueries } from '@/features/kits/api/kit-queries';
import { useUpdateKitItem } from '@/features/kits/api/use-save-kit';

const fields = ['kindId', 'kitId', 'serialNumber', 'condition', 'notes', 'vibrationMs2'] as const;

function prepare(values: Record<string, string | undefined>) {
  return {
    kindId: values.kindId ? Number(values.kindId) : undefined,
    kitId: values.kitId ? Number(values.kitId) : null,
    serialNumber: textOrNull(values.serialNumber),
    condition: values.condition,
    notes: textOrNull(values.notes),
    vibrationMs2: values.vibrationMs2?.trim() ? Number(values.vibrationMs2) : null,
  };
}

/** Details only: where an item is changes through check-out and check-in, never by editing. */
export function KitItemEditForm({ item, onDone }: { item: KitItem; onDone: () => void }) {
  const kinds = useQuery(itemKindQueries.list());
  const kits = useQuery(kitQueries.list());
  const update = useUpdateKitItem();
  const form = useSchemaForm(updateKitItemInputSchema, fields, prepare);
  const kindOptions = (kinds.data ?? [item.kind]).map((k) => ({ value: String(k.id), label: k.name }));
  const kitOptions = [
    { value: '', label: 'Loose (no kit)' },
    ...(kits.data ?? (item.kit ? [item.kit] : [])).map((k) => ({ value: String(k.id), label: k.name })),
  ];
  return (
    <form
      ref={form.formRef}
      noValidate
      aria-label={`Edit ${item.assetTag}`}
      className="space-y-4"
      onSubmit={form.handleSubmit((input) =>
        update.mutate({ id: item.id, ...input }, { onError: form.showError, onSuccess: onDone }),
      )}
    >
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField
          label="Kind"
          name="kindId"
          defaultValue={String(item.kind.id)}
          options={kindOptions}
          error={form.fieldErrors.kindId}
        />
        <SelectField
          label="Kit"
          name="kitId"
          defaultValue={item.kit ? String(item.kit.id) : ''}
          options={kitOptions}
          error={form.fieldErrors.kitId}
        />
        <SelectField
          label="Condition"
          name="condition"
          defaultValue={item.condition}
          options={itemConditions.map((c) => ({ value: c, label: itemConditionLabels[c] }))}
          error={form.fieldErrors.condition}
        />
        <TextField
          label="Serial number"
          name="serialNumber"
          defaultValue={item.serialNumber ?? ''}
          autoComplete="off"
          error={form.fieldErrors.serialNumber}
        />
        <TextField
          label="Notes"
          name="notes"
          defaultValue={item.notes ?? ''}
          autoComplete="off"
          error={form.fieldErrors.notes}
          className="sm:col-span-2"
        />
        <TextField
          label="Vibration magnitude (m/s²)"
          name="vibrationMs2"
          type="number"
          inputMode="decimal"
          min={0}
          step="any"
          defaultValue={item.vibrationMs2 === null ? '' : String(item.vibrationMs2)}
          hint="For a vibrating tool such as an agitator head: from the tool’s maker or the firm’s own measurement. Used for the engineer’s hand-arm vibration points."
          autoComplete="off"
          error={form.fieldErrors.vibrationMs2}
          className="sm:col-span-2"
        />
      </div>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" busy={update.isPending}>
          Save item
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
