import { useState } from 'react';
import { useLocation } from 'react-router-dom';
import { moveInputSchema } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextareaField } from '@/components/ui/textarea-field';
import { useSchemaForm } from '@/lib/form';
import { useFormDraft } from '@/lib/offline/use-form-draft';
import { useQueuedCustody, type CustodyScope } from '@/features/kits/api/use-custody';
import {
  custodyDraftKey,
  defaultScope,
  reportOutcome,
  ScopeChoice,
  vanLabel,
  type CustodyFinish,
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
  onDone: CustodyFinish;
  onCancel: () => void;
}

export function MoveForm({ targets, vans, onDone, onCancel }: MoveFormProps) {
  const [scope, setScope] = useState<CustodyScope>(() => defaultScope(targets));
  const custody = useQueuedCustody();
  const href = useLocation().pathname;
  const form = useSchemaForm(moveInputSchema, fields, prepare);
  const draftKey = custodyDraftKey(targets, 'move');
  useFormDraft(form.formRef, draftKey, { value: scope, restore: setScope });
  const what = scope.kind === 'kit' ? (targets.kit?.name ?? 'the kit') : (targets.item?.assetTag ?? 'the item');

  return (
    <form
      ref={form.formRef}
      noValidate
      className="space-y-4"
      aria-label="Move to another van"
      onSubmit={form.handleSubmit(async (input) => {
        const van = vans.find((v) => v.id === input.toLocationId);
        try {
          const outcome = await custody.send(
            scope,
            { action: 'move', input },
            {
              label: `Move ${what} to ${van?.name ?? 'another van'}`,
              to: van ? { ...van, kind: 'van' as const } : null,
              draftKey,
              href,
            },
          );
          reportOutcome(outcome, `Moved to ${van ? vanLabel(van) : 'the other van'}.`, 'the move', onDone);
        } catch (error) {
          form.showError(error);
        }
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
