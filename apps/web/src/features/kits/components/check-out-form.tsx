import { useMemo, useState } from 'react';
import { useLocation } from 'react-router-dom';
import { checkOutInputSchema, type KitItem } from '@heatfleet/domain';
import { z } from 'zod';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextareaField } from '@/components/ui/textarea-field';
import { TextField } from '@/components/ui/text-field';
import { isApiError } from '@/lib/api-client';
import { useSchemaForm } from '@/lib/form';
import { useFormDraft } from '@/lib/offline/use-form-draft';
import { useQueuedCustody, type CustodyScope } from '@/features/kits/api/use-custody';
import {
  custodyDraftKey,
  defaultScope,
  isInspectionOverdue,
  reportOutcome,
  ScopeChoice,
  vanLabel,
  type CustodyFinish,
  type CustodyTargets,
  type CustodyVan,
} from '@/features/kits/components/custody-shared';

const fields = ['toLocationId', 'overdueReason', 'note'] as const;

function prepare(values: Record<string, string | undefined>) {
  return {
    toLocationId: values.toLocationId ? Number(values.toLocationId) : undefined,
    overdueReason: values.overdueReason?.trim() ? values.overdueReason : undefined,
    note: values.note,
  };
}

const withReasonSchema = checkOutInputSchema.extend({
  overdueReason: z
    .string({ error: 'Say why it goes out before inspection.' })
    .trim()
    .min(3, { error: 'Say why it goes out before inspection (at least 3 characters).' })
    .max(500),
});

interface CheckOutFormProps {
  targets: CustodyTargets;
  /** The vans this member may check out to; an engineer has only their own. */
  vans: CustodyVan[];
  /** The items that would go, to warn about any overdue for inspection before sending. */
  items: KitItem[];
  onDone: CustodyFinish;
  onCancel: () => void;
}

export function CheckOutForm({ targets, vans, items, onDone, onCancel }: CheckOutFormProps) {
  const [scope, setScope] = useState<CustodyScope>(() => defaultScope(targets));
  const [serverOverdue, setServerOverdue] = useState<{ path: string; message: string }[] | null>(null);
  const custody = useQueuedCustody();
  const href = useLocation().pathname;

  const going = scope.kind === 'kit' ? items : items.filter((item) => item.id === scope.id);
  const overdue = going.filter((item) => item.inspection.state === 'overdue');
  const blocked = overdue.filter((item) => item.kind.overduePolicy === 'block');
  const needsReason = (overdue.length > 0 && blocked.length < overdue.length) || serverOverdue !== null;
  const schema = useMemo(() => (needsReason ? withReasonSchema : checkOutInputSchema), [needsReason]);
  const form = useSchemaForm(schema, fields, prepare);
  const draftKey = custodyDraftKey(targets, 'check-out');
  useFormDraft(form.formRef, draftKey, { value: scope, restore: setScope });
  const only = vans.length === 1 ? vans[0] : undefined;
  const what = scope.kind === 'kit' ? (targets.kit?.name ?? 'the kit') : (targets.item?.assetTag ?? 'the item');

  return (
    <form
      ref={form.formRef}
      noValidate
      className="space-y-4"
      aria-label="Check out"
      onSubmit={form.handleSubmit(async (input) => {
        const van = vans.find((v) => v.id === input.toLocationId);
        const to = van ? { ...van, kind: 'van' as const } : null;
        try {
          const outcome = await custody.send(
            scope,
            { action: 'check-out', input },
            { label: `Check out ${what} to ${van?.name ?? 'a van'}`, to, draftKey, href },
          );
          reportOutcome(outcome, `Checked out to ${van ? vanLabel(van) : 'the van'}.`, 'the check-out', onDone);
        } catch (error) {
          // Asked for a reason we did not give (our copy of the due dates was stale): ask, then send again.
          if (isInspectionOverdue(error) && isApiError(error) && !input.overdueReason) {
            setServerOverdue(error.details);
            form.clearErrors();
            return;
          }
          form.showError(error);
        }
      })}
    >
      <ScopeChoice targets={targets} scope={scope} onChange={setScope} />

      {only ? (
        <div>
          <input type="hidden" name="toLocationId" value={only.id} />
          <p className="font-semibold">To your van</p>
          <p className="text-lg">{vanLabel(only)}</p>
        </div>
      ) : (
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
      )}

      {blocked.length > 0 ? (
        <Alert tone="error" title="Inspect these first: their kind may not go out overdue.">
          <ul className="list-disc pl-5">
            {blocked.map((item) => (
              <li key={item.id}>
                {item.assetTag} ({item.kind.name})
              </li>
            ))}
          </ul>
        </Alert>
      ) : null}
      {overdue.length > blocked.length || serverOverdue ? (
        <Alert tone="info" title="Overdue for inspection">
          <ul className="list-disc pl-5">
            {serverOverdue
              ? serverOverdue.map((detail) => <li key={detail.path}>{detail.message}</li>)
              : overdue
                  .filter((item) => item.kind.overduePolicy !== 'block')
                  .map((item) => (
                    <li key={item.id}>
                      {item.assetTag} ({item.kind.name})
                    </li>
                  ))}
          </ul>
        </Alert>
      ) : null}
      {needsReason ? (
        <TextField
          label="Why it goes out before inspection"
          name="overdueReason"
          autoComplete="off"
          error={form.fieldErrors.overdueReason}
        />
      ) : null}

      <TextareaField label="Note (optional)" name="note" error={form.fieldErrors.note} />
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      <div className="flex flex-col gap-2 sm:flex-row">
        <Button type="submit" busy={custody.isPending} className="min-h-14 text-lg sm:min-w-48">
          {only ? `Check out to ${only.name}` : 'Check out'}
        </Button>
        <Button variant="secondary" onClick={onCancel} className="min-h-14">
          Cancel
        </Button>
      </div>
    </form>
  );
}
