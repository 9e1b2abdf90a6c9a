import { useState } from 'react';
import { useLocation } from 'react-router-dom';
import { checkInInputSchema, itemConditionLabels, type KitItem } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextareaField } from '@/components/ui/textarea-field';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/lib/form';
import { useFormDraft } from '@/lib/offline/use-form-draft';
import { useQueuedCustody, type CustodyScope } from '@/features/kits/api/use-custody';
import {
  custodyDraftKey,
  defaultScope,
  reportOutcome,
  ScopeChoice,
  type CustodyDepot,
  type CustodyFinish,
  type CustodyTargets,
} from '@/features/kits/components/custody-shared';
import {
  CheckInItems,
  checkInItems,
  DepotSelect,
  initialItemStates,
  type CheckInItemState,
} from '@/features/kits/components/check-in-items';
import { PhotoField } from '@/features/kits/components/photo-field';

const fields = ['missingParts', 'note', 'toLocationId'] as const;

function prepare(values: Record<string, string | undefined>) {
  return { ...values, toLocationId: values.toLocationId ? Number(values.toLocationId) : undefined };
}

interface CheckInFormProps {
  targets: CustodyTargets;
  depots: CustodyDepot[];
  /** The items being checked in with the kit (or the one item), each given its own condition. */
  items: KitItem[];
  onDone: CustodyFinish;
  onCancel: () => void;
}

/** What the check-in keeps in state beside its fields, saved in its draft too. */
interface CheckInExtra {
  scope: CustodyScope;
  photo: File | null;
  conditions: CheckInItemState;
}

export function CheckInForm({ targets, depots, items, onDone, onCancel }: CheckInFormProps) {
  const [extra, setExtra] = useState<CheckInExtra>(() => ({
    scope: defaultScope(targets),
    photo: null,
    conditions: initialItemStates(items),
  }));
  const { scope, photo, conditions } = extra;
  const inScope = scope.kind === 'kit' ? items : items.filter((i) => i.id === scope.id);
  const custody = useQueuedCustody();
  const href = useLocation().pathname;
  const form = useSchemaForm(checkInInputSchema, fields, prepare);
  const draftKey = custodyDraftKey(targets, 'check-in');
  useFormDraft(form.formRef, draftKey, { value: extra, restore: setExtra });
  const what = scope.kind === 'kit' ? (targets.kit?.name ?? 'the kit') : (targets.item?.assetTag ?? 'the item');

  return (
    <form
      ref={form.formRef}
      noValidate
      className="space-y-4"
      aria-label="Check in"
      onSubmit={form.handleSubmit(async (input) => {
        const depot = depots.find((d) => d.id === input.toLocationId) ?? depots[0];
        const to = depot
          ? { id: depot.id, kind: 'depot' as const, name: depot.name, registration: null, engineerName: null }
          : null;
        const perItem = checkInItems(inScope, conditions);
        const notInService = perItem.filter((i) => i.condition !== 'in_service').length;
        const cleaned = perItem.filter((i) => i.cleaned).length;
        try {
          // The photo is shrunk on the phone and uploaded just before the check-in, which then carries its id.
          const outcome = await custody.send(
            scope,
            { action: 'check-in', input: { ...input, items: perItem } },
            {
              label: `Check in ${what}${depot ? ` to ${depot.name}` : ''}${photo ? ' with a photo' : ''}`,
              to,
              draftKey,
              href,
              photo: photo ? { file: photo, itemId: targets.item?.id } : null,
            },
          );
          reportOutcome(
            outcome,
            `Checked in${depot ? ` to ${depot.name}` : ''}: ${
              notInService
                ? `${notInService} item${notInService === 1 ? '' : 's'} not in service`
                : itemConditionLabels.in_service.toLowerCase()
            }${cleaned ? `, ${cleaned} cleaned` : ''}.`,
            'the check-in',
            onDone,
          );
        } catch (error) {
          form.showError(error);
        }
      })}
    >
      <ScopeChoice targets={targets} scope={scope} onChange={(next) => setExtra((was) => ({ ...was, scope: next }))} />
      {depots.length > 1 ? (
        <DepotSelect depots={depots} error={form.fieldErrors.toLocationId} />
      ) : depots[0] ? (
        <p>
          <span className="font-semibold">Back to depot: </span>
          {depots[0].name}
        </p>
      ) : null}
      {inScope.length ? (
        <CheckInItems
          items={inScope}
          states={conditions}
          onChange={(next) => setExtra((was) => ({ ...was, conditions: next }))}
        />
      ) : null}
      <TextField
        label="Missing parts (if any)"
        name="missingParts"
        autoComplete="off"
        error={form.fieldErrors.missingParts}
      />
      <TextareaField label="Note (optional)" name="note" error={form.fieldErrors.note} />
      <PhotoField
        label="Photo (optional)"
        file={photo}
        onChange={(next) => setExtra((was) => ({ ...was, photo: next }))}
        error={form.fieldErrors.photoId}
      />
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      <div className="flex flex-col gap-2 sm:flex-row">
        <Button type="submit" busy={custody.isPending} className="min-h-14 text-lg sm:min-w-48">
          {custody.isPending && photo ? 'Sending photo…' : 'Check in'}
        </Button>
        <Button variant="secondary" onClick={onCancel} className="min-h-14">
          Cancel
        </Button>
      </div>
    </form>
  );
}
