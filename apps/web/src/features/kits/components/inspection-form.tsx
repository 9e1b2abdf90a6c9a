import { useRef, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { calendarDateIn, electricalTestInputSchema, recordInspectionInputSchema } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { TextareaField } from '@/components/ui/textarea-field';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/lib/form';
import { useIdempotencyKey } from '@/lib/idempotency';
import { itemKindQueries, kitItemQueries } from '@/features/kits/api/kit-queries';
import { uploadPhoto } from '@/features/kits/api/upload-photo';
import { useRecordInspection } from '@/features/kits/api/use-record-inspection';
import {
  ElectricalTestFields,
  electricalInput,
  emptyElectrical,
  type ElectricalDraft,
} from '@/features/kits/components/electrical-test-fields';
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
  // An electrical kind may be given a visual inspection only, or the inspection and test (IET Code of Practice).
  const item = useQuery(kitItemQueries.detail(itemId));
  const kinds = useQuery(itemKindQueries.list());
  const electricalKind = kinds.data?.find((k) => k.id === item.data?.item.kind.id)?.electrical ?? false;
  const [testing, setTesting] = useState(false);
  const [electrical, setElectrical] = useState<ElectricalDraft>(emptyElectrical);
  const [electricalErrors, setElectricalErrors] = useState<Record<string, string>>({});

  return (
    <form
      key={formKey}
      ref={form.formRef}
      noValidate
      className="space-y-4"
      aria-label="Record an inspection"
      onSubmit={form.handleSubmit(async (input) => {
        setSaved(null);
        let test: ReturnType<typeof electricalTestInputSchema.parse> | undefined;
        if (electricalKind && testing) {
          const parsed = electricalTestInputSchema.safeParse(electricalInput(electrical));
          if (!parsed.success) {
            setElectricalErrors(
              Object.fromEntries(parsed.error.issues.map((i) => [`electrical.${i.path.join('.')}`, i.message])),
            );
            return;
          }
          setElectricalErrors({});
          test = parsed.data;
        }
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
        const body = {
          itemId,
          input: { ...input, ...(photoId ? { photoId } : {}), ...(test ? { electrical: test } : {}) },
        };
        record.mutate(
          { ...body, idempotencyKey: idempotency.keyFor(body) },
          {
            onSuccess: ({ inspection }) => {
              idempotency.done();
              uploaded.current = null;
              setPhoto(null);
              setFormKey((n) => n + 1);
              setElectrical(emptyElectrical);
              setSaved(
                inspection.result === 'passed'
                  ? 'Inspection recorded: passed.'
                  : inspection.electrical?.result === 'fail'
                    ? 'Inspection recorded: failed. The item is out of service until it is repaired and tested again.'
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
      {electricalKind ? (
        <ChoiceGroup
          legend="What was done"
          name="inspection-kind"
          columns={2}
          value={testing ? 'test' : 'visual'}
          onChange={(v) => setTesting(v === 'test')}
          options={[
            { value: 'visual', label: 'Visual inspection', hint: 'Looked over, not tested' },
            { value: 'test', label: 'Inspection and test', hint: 'Earth, insulation and polarity measured' },
          ]}
        />
      ) : null}
      {electricalKind && testing ? (
        <ElectricalTestFields draft={electrical} onChange={setElectrical} errors={electricalErrors} />
      ) : null}
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
