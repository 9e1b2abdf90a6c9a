import { useRef, useState } from 'react';
import { calendarDateIn, recordInspectionInputSchema } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { TextareaField } from '@/components/ui/textarea-field';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/lib/form';
import { useIdempotencyKey } from '@/lib/idempotency';
import { uploadPhoto } from '@/features/kits/api/upload-photo';
import { useRecordInspection } from '@/features/kits/api/use-record-inspection';
import { PhotoField } from '@/features/kits/components/photo-field';

const fields = ['result', 'notes', 'inspectedOn'] as const;

export function InspectionForm({ itemId, timeZone }: { itemId: number; timeZone: string }) {
  const record = useRecordInspection();
  const idempotency = useIdempotencyKey();
  const form = useSchemaForm(recordInspectionInputSchema, fields);
  const [photo, setPhoto] = useState<File | null>(null);
  const [uploading, setUploading] = useState(false);
  const uploaded = useRef<{ file: File; id: number } | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  // Re-rendering the inputs with a new key clears them after a save without a page reload.
  const [formKey, setFormKey] = useState(0);
  const today = calendarDateIn(new Date(), timeZone);

  return (
    <form
      key={formKey}
      ref={form.formRef}
      noValidate
      className="space-y-4"
      aria-label="Record an inspection"
      onSubmit={form.handleSubmit(async (input) => {
        setSaved(null);
        let photoId: number | undefined;
        if (photo) {
          if (uploaded.current?.file !== photo) {
            setUploading(true);
            try {
              uploaded.current = { file: photo, id: (await uploadPhoto(photo, itemId)).id };
            } catch (error) {
              form.showError(error);
              return;
            } finally {
              setUploading(false);
            }
          }
          photoId = uploaded.current.id;
        }
        const body = { itemId, input: { ...input, ...(photoId ? { photoId } : {}) } };
        record.mutate(
          { ...body, idempotencyKey: idempotency.keyFor(body) },
          {
            onSuccess: ({ inspection }) => {
              idempotency.done();
              uploaded.current = null;
              setPhoto(null);
              setFormKey((n) => n + 1);
              setSaved(
                inspection.result === 'passed'
                  ? 'Inspection recorded: passed.'
                  : 'Inspection recorded: failed. The item now needs attention.',
              );
            },
            onError: form.showError,
          },
        );
      })}
    >
      {saved ? <Alert tone="success">{saved}</Alert> : null}
      <ChoiceGroup
        legend="Result"
        name="result"
        columns={2}
        options={[
          { value: 'passed', label: 'Passed', hint: 'Fit to go out' },
          { value: 'failed', label: 'Failed', hint: 'Marks it as needing attention' },
        ]}
        error={form.fieldErrors.result}
      />
      <TextField
        label="Inspected on"
        name="inspectedOn"
        type="date"
        defaultValue={today}
        max={today}
        error={form.fieldErrors.inspectedOn}
      />
      <TextareaField label="Notes (optional)" name="notes" error={form.fieldErrors.notes} />
      <PhotoField label="Photo (optional)" file={photo} onChange={setPhoto} error={form.fieldErrors.photoId} />
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      <Button type="submit" busy={uploading || record.isPending} className="min-h-14 w-full text-lg sm:w-auto">
        {uploading ? 'Sending photo…' : 'Record inspection'}
      </Button>
    </form>
  );
}
