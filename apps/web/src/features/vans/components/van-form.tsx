import { createVanInputSchema, updateVanInputSchema, type Van } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { idOrNull, textOrNull, useSchemaForm } from '@/lib/form';
import { useCreateVan, useUpdateVan } from '@/features/vans/api/use-save-van';

const fields = ['name', 'registration', 'engineerMemberId', 'motDueOn', 'serviceDueOn', 'notes'] as const;

function prepare(values: Record<string, string | undefined>) {
  return {
    ...values,
    engineerMemberId: idOrNull(values.engineerMemberId),
    motDueOn: textOrNull(values.motDueOn),
    serviceDueOn: textOrNull(values.serviceDueOn),
  };
}

export interface EngineerOption {
  memberId: number;
  name: string;
}

interface VanFormProps {
  engineers: EngineerOption[];
  /** Left out for a new van. */
  van?: Van;
  onSaved?: (van: Van) => void;
}

export function VanForm({ engineers, van, onSaved }: VanFormProps) {
  const create = useCreateVan();
  const update = useUpdateVan();
  const form = useSchemaForm(van ? updateVanInputSchema : createVanInputSchema, fields, prepare);
  const pending = create.isPending || update.isPending;
  const engineerOptions = [
    { value: '', label: 'Nobody yet' },
    ...engineers.map((e) => ({ value: String(e.memberId), label: e.name })),
  ];

  return (
    <form
      ref={form.formRef}
      noValidate
      className="space-y-4"
      onSubmit={form.handleSubmit((input) => {
        const options = { onError: form.showError, onSuccess: (saved: Van) => onSaved?.(saved) };
        if (van) update.mutate({ id: van.id, ...input }, options);
        else
          create.mutate(createVanInputSchema.parse(input), {
            ...options,
            onSuccess: (saved) => {
              form.formRef.current?.reset();
              onSaved?.(saved);
            },
          });
      })}
    >
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label="Name"
          name="name"
          defaultValue={van?.name}
          required
          error={form.fieldErrors.name}
          autoComplete="off"
        />
        <TextField
          label="Registration"
          name="registration"
          defaultValue={van?.registration}
          required
          autoCapitalize="characters"
          autoComplete="off"
          error={form.fieldErrors.registration}
        />
        <SelectField
          label="Engineer"
          name="engineerMemberId"
          options={engineerOptions}
          defaultValue={van?.engineer ? String(van.engineer.memberId) : ''}
          error={form.fieldErrors.engineerMemberId}
        />
        <TextField
          label="MOT due"
          name="motDueOn"
          type="date"
          defaultValue={van?.motDueOn ?? ''}
          error={form.fieldErrors.motDueOn}
        />
        <TextField
          label="Service due"
          name="serviceDueOn"
          type="date"
          defaultValue={van?.serviceDueOn ?? ''}
          error={form.fieldErrors.serviceDueOn}
        />
        <TextField
          label="Notes"
          name="notes"
          defaultValue={van?.notes ?? ''}
          error={form.fieldErrors.notes}
          autoComplete="off"
        />
      </div>
      <Button type="submit" busy={pending}>
        {van ? 'Save van' : 'Add van'}
      </Button>
    </form>
  );
}
