import { useRef, useState } from 'react';
import { checkInInputSchema, itemConditionLabels, itemConditions } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { SelectField } from '@/components/ui/select-field';
import { TextareaField } from '@/components/ui/textarea-field';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/lib/form';
import { useIdempotencyKey } from '@/lib/idempotency';
import { uploadPhoto } from '@/features/kits/api/upload-photo';
import { useCustody, type CustodyScope } from '@/features/kits/api/use-custody';
import {
  defaultScope,
  ScopeChoice,
  type CustodyDepot,
  type CustodyTargets,
} from '@/features/kits/components/custody-shared';
import { PhotoField } from '@/features/kits/components/photo-field';

const fields = ['condition', 'missingParts', 'note', 'toLocationId'] as const;

function prepare(values: Record<string, string | undefined>) {
  return { ...values, toLocationId: values.toLocationId ? Number(values.toLocationId) : undefined };
}

const conditionHints = {
  in_service: 'Clean, complete, ready for the next job',
  needs_attention: 'Usable, but something wants looking at',
  out_of_service: 'Not to go out again until repaired',
} as const;

interface CheckInFormProps {
  targets: CustodyTargets;
  depots: CustodyDepot[];
  onDone: (message: string) => void;
  onCancel: () => void;
}

export function CheckInForm({ targets, depots, onDone, onCancel }: CheckInFormProps) {
  const [scope, setScope] = useState<CustodyScope>(() => defaultScope(targets));
  const [photo, setPhoto] = useState<File | null>(null);
  const [uploading, setUploading] = useState(false);
  // A retry after a dropped signal must not upload the photo again (a second photo, a new body, a new key).
  const uploaded = useRef<{ file: File; id: number } | null>(null);
  const custody = useCustody();
  const idempotency = useIdempotencyKey();
  const form = useSchemaForm(checkInInputSchema, fields, prepare);

  return (
    <form
      ref={form.formRef}
      noValidate
      className="space-y-4"
      aria-label="Check in"
      onSubmit={form.handleSubmit(async (input) => {
        let photoId: number | undefined;
        if (photo) {
          if (uploaded.current?.file !== photo) {
            setUploading(true);
            try {
              const sent = await uploadPhoto(photo, targets.item?.id);
              uploaded.current = { file: photo, id: sent.id };
            } catch (error) {
              form.showError(error);
              return;
            } finally {
              setUploading(false);
            }
          }
          photoId = uploaded.current.id;
        }
        const body = {
          scope,
          request: { action: 'check-in' as const, input: { ...input, ...(photoId ? { photoId } : {}) } },
        };
        custody.mutate(
          { ...body, idempotencyKey: idempotency.keyFor(body) },
          {
            onSuccess: () => {
              idempotency.done();
              const depot = depots.find((d) => d.id === input.toLocationId) ?? depots[0];
              onDone(
                `Checked in${depot ? ` to ${depot.name}` : ''}, ${itemConditionLabels[input.condition].toLowerCase()}.`,
              );
            },
            onError: form.showError,
          },
        );
      })}
    >
      <ScopeChoice targets={targets} scope={scope} onChange={setScope} />
      <ChoiceGroup
        legend="Condition"
        name="condition"
        options={itemConditions.map((c) => ({ value: c, label: itemConditionLabels[c], hint: conditionHints[c] }))}
        error={form.fieldErrors.condition}
      />
      {depots.length > 1 ? (
        <SelectField
          label="Back to"
          name="toLocationId"
          defaultValue={String(depots[0]!.id)}
          options={depots.map((d) => ({ value: String(d.id), label: d.name }))}
          error={form.fieldErrors.toLocationId}
        />
      ) : null}
      <TextField
        label="Missing parts (if any)"
        name="missingParts"
        autoComplete="off"
        error={form.fieldErrors.missingParts}
      />
      <TextareaField label="Note (optional)" name="note" error={form.fieldErrors.note} />
      <PhotoField label="Photo (optional)" file={photo} onChange={setPhoto} error={form.fieldErrors.photoId} />
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      <div className="flex flex-col gap-2 sm:flex-row">
        <Button type="submit" busy={uploading || custody.isPending} className="min-h-14 text-lg sm:min-w-48">
          {uploading ? 'Sending photo…' : 'Check in'}
        </Button>
        <Button variant="secondary" onClick={onCancel} className="min-h-14">
          Cancel
        </Button>
      </div>
    </form>
  );
}
