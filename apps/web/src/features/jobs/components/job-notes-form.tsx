import { useState, type FormEvent } from 'react';
import { jobNotesInputSchema, type JobSheet } from '@heatfleet/domain';
import { Button } from '@/components/ui/button';
import { TextareaField } from '@/components/ui/textarea-field';
import { useSaveNotes } from '@/features/jobs/api/use-job-sheet-mutations';
import { SaveFeedback } from '@/features/jobs/components/save-feedback';

export function JobNotesForm({ jobId, sheet }: { jobId: number; sheet: JobSheet }) {
  const [notes, setNotes] = useState(sheet.notes);
  const [error, setError] = useState<string | undefined>();
  const save = useSaveNotes(jobId);
  const dirty = notes !== sheet.notes;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = jobNotesInputSchema.safeParse({ notes });
    if (!parsed.success) {
      setError(parsed.error.issues[0]?.message);
      return;
    }
    setError(undefined);
    save.mutate(parsed.data.notes, { onSuccess: (next) => setNotes(next.notes) });
  };

  return (
    <form aria-label="Notes" noValidate onSubmit={submit} className="space-y-3">
      <TextareaField
        label="Notes for the record"
        name="notes"
        rows={4}
        hint="What you found and did, and anything the customer or the next engineer should know. Printed on the report."
        readOnly={!sheet.editable}
        value={notes}
        onChange={(e) => {
          save.reset();
          setNotes(e.target.value);
        }}
        error={error}
      />
      {sheet.editable ? (
        <>
          <SaveFeedback error={save.error} saved={save.isSuccess && !dirty} />
          <Button type="submit" variant="secondary" className="min-h-12 w-full sm:w-auto" busy={save.isPending}>
            Save the notes
          </Button>
        </>
      ) : null}
    </form>
  );
}
