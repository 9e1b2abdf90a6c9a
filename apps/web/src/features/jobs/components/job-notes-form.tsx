import { jobNotesInputSchema, type JobSheet } from '@heatfleet/domain';
import { TextareaField } from '@/components/ui/textarea-field';
import { useSheetPut } from '@/features/jobs/api/use-job-sheet-mutations';
import { useAutosave } from '@/features/jobs/components/autosave-context';
import { SavedMark } from '@/features/jobs/components/saved-mark';

/** The notes save themselves a moment after typing stops, and when the box is left. */
export function JobNotesForm({ jobId, sheet }: { jobId: number; sheet: JobSheet }) {
  const put = useSheetPut(jobId);
  const slot = useAutosave('notes', () => sheet.notes, {
    label: 'Notes',
    delayMs: 1500,
    parse: (notes: string) => {
      const parsed = jobNotesInputSchema.safeParse({ notes });
      return parsed.success
        ? { ok: true, input: parsed.data.notes }
        : { ok: false, empty: false, errors: { notes: parsed.error.issues[0]?.message ?? 'Too long.' } };
    },
    send: (notes: string) => put('/notes', { notes }),
    savedInput: sheet.notes,
  });
  return (
    <div role="group" aria-label="Notes" className="space-y-2">
      <TextareaField
        label="Notes for the record"
        name="notes"
        rows={4}
        hint="What you found and did, and anything the customer or the next engineer should know. Printed on the report."
        readOnly={!sheet.editable}
        value={slot.draft}
        onChange={(e) => slot.edit(e.target.value)}
        onBlur={() => void slot.flush()}
        error={slot.errors.notes}
      />
      <SavedMark
        status={slot.status}
        stored={slot.stored && slot.draft !== ''}
        failure={slot.failure}
        onRetry={() => void slot.flush()}
      />
    </div>
  );
}
