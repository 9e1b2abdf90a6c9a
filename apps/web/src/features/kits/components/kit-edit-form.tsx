import { updateKitInputSchema, type Kit } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { textOrNull, useSchemaForm } from '@/lib/form';
import { useUpdateKit } from '@/features/kits/api/use-save-kit';

const fields = ['name', 'notes'] as const;

function prepare(values: Record<string, string | undefined>) {
  return { name: values.name, notes: textOrNull(values.notes) };
}

export function KitEditForm({ kit, onDone }: { kit: Kit; onDone: () => void }) {
  const update = useUpdateKit();
  const form = useSchemaForm(updateKitInputSchema, fields, prepare);
  return (
    <form
      ref={form.formRef}
      noValidate
      aria-label={`Edit ${kit.name}`}
      className="space-y-4"
      onSubmit={form.handleSubmit((input) =>
        update.mutate({ id: kit.id, ...input }, { onError: form.showError, onSuccess: onDone }),
      )}
    >
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label="Kit name"
          name="name"
          defaultValue={kit.name}
          autoComplete="off"
          error={form.fieldErrors.name}
        />
        <TextField
          label="Notes"
          name="notes"
          defaultValue={kit.notes ?? ''}
          autoComplete="off"
          error={form.fieldErrors.notes}
        />
      </div>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" busy={update.isPending}>
          Save kit
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
