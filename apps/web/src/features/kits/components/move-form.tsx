import { useState } from 'react';
import { moveInputSchema } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextareaField } from '@/components/ui/textarea-field';
import { useSchemaForm } from '@/lib/form';
import { useIdempotencyKey } from '@/lib/idempotency';
import { useCustody, type CustodyScope } from '@/features/kits/api/use-custody';
import {
  defaultScope,
  ScopeChoice,
  vanLabel,
  type CustodyTargets,
  type CustodyVan,
} from '@/features/kits/components/custody-shared';

const fields = ['toLocationId', 'note'] as const;

function prepare(values: Record<string, string | undefined>) {
  return { ...values, toLocationId: values.toLocationId ? Number(values.toLocationId) : undefined };
}

interface MoveFormProps {
  targets: CustodyTargets;
  /** Every other van it could go on to. */
  vans: CustodyVan[];
  onDone: (message: string) => void;
  onCancel: () => void;
}

export function MoveForm({ targets, vans, onDone, onCancel }: MoveFormProps) {
  const [scope, setScope] = useState<CustodyScope>(() => defaultScope(targets));
  const custody = useCustody();
  const idempotency = useIdempotencyKey();
  const form = useSchemaForm(moveInputSchema, fields, prepare);

  return (
    <form
      ref={form.formRef}
      noValidate
      className="space-y-4"
      aria-label="Move to another van"
      onSubmit={form.handleSubmit((input) => {
        const body = { scope, request: { action: 'move' as const, input } };
        custody.mutate(
          { ...body, idempotencyKey: idempotency.keyFor(body) },
          {
            onSuccess: () => {
              idempotency.done();
              const van = vans.find((v) => v.id === input.toLocationId);
              onDone(`Moved to ${van ? vanLabel(van) : 'the other van'}.`);
            },
            onError: form.showError,
          },
        );
      })}
    >
      <ScopeChoice targets={targets} scope={scope} onChange={setScope} />
      <SelectField
        label="To which van"
        name="toLocationId"
        defaultValue=""
        options={[
          { value: '', label: 'Choose a van…' },
          ...vans.map((van) => ({ value: String(van.id), label: vanLabel(van) })),
        ]}
        error={form.fieldErrors.toLocationId}
      />
      <TextareaField label="Note (optional)" name="note" error={form.fieldErrors.note} />
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      <div className="flex flex-col gap-2 sm:flex-row">
        <Button type="submit" busy={custody.isPending} className="min-h-14 text-lg sm:min-w-48">
          Move
        </Button>
        <Button variant="secondary" onClick={onCancel} className="min-h-14">
          Cancel
        </Button>
      </div>
    </form>
  );
}
