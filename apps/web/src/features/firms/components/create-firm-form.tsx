import { useState } from 'react';
import { createFirmInputSchema } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/lib/form';
import { useCreateFirm } from '@/features/firms/api/use-create-firm';

const fields = ['firmName'] as const;

/** Behind a button, so the card stays short: most people work for one firm. */
export function CreateFirmForm() {
  const [open, setOpen] = useState(false);
  const createFirm = useCreateFirm();
  const form = useSchemaForm(createFirmInputSchema, fields);

  if (!open) {
    return (
      <Button variant="secondary" className="w-full" onClick={() => setOpen(true)}>
        Create another firm
      </Button>
    );
  }
  return (
    <form
      ref={form.formRef}
      noValidate
      className="space-y-3"
      onSubmit={form.handleSubmit((input) =>
        createFirm.mutate(input, { onError: form.showError, onSuccess: () => setOpen(false) }),
      )}
    >
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      <TextField
        label="New firm's name"
        name="firmName"
        autoComplete="organization"
        hint="You become its Owner and switch to it; your other firms stay as they are."
        required
        error={form.fieldErrors.firmName}
      />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" busy={createFirm.isPending}>
          Create the firm
        </Button>
        <Button variant="secondary" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
