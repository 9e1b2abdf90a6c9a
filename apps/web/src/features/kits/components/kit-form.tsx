import type { Kit } from '@heatfleet/domain';
import { createKitInputSchema } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/lib/form';
import { useCreateKit } from '@/features/kits/api/use-save-kit';

const fields = ['name', 'notes'] as const;

export function KitForm({ onSaved }: { onSaved?: (kit: Kit) => void }) {
  const create = useCreateKit();
  const form = useSchemaForm(createKitInputSchema, fields);
  return (
    <form
      ref={form.formRef}
      noValidate
      className="space-y-4"
      aria-label="New kit"
      onSubmit={form.handleSubmit((input) =>
        create.mutate(input, {
          onError: form.showError,
          onSuccess: (kit) => {
            form.formRef.current?.reset();
            onSaved?.(kit);
          },
        }),
      )}
    >
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      {create.isSuccess ? <Alert tone="success">Kit {create.data.name} added.</Alert> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Kit name" name="name" required autoComplete="off" error={form.fieldErrors.name} />
        <TextField label="Notes" name="notes" autoComplete="off" error={form.fieldErrors.notes} />
      </div>
      <Button type="submit" busy={create.isPending}>
        Add kit
      </Button>
    </form>
  );
}
