import { useRef } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { jobNotesInputSchema, type JobSheet } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextareaField } from '@/components/ui/textarea-field';
import { useOutbox, type QueuedWrite } from '@/lib/offline/outbox';
import { discardWrite } from '@/lib/offline/outbox-actions';
import { jobQueries } from '@/features/jobs/api/job-queries';
import { useSheetPut } from '@/features/jobs/api/use-job-sheet-mutations';
import { useAutosave } from '@/features/jobs/components/autosave-context';
import { SavedMark } from '@/features/jobs/components/saved-mark';

/**
 * The notes save themselves a moment after typing stops, and when the box is left. Two people may write them, so
 * each save names the version it was written from; if someone else saved in between, the server refuses it (409)
 * and the engineer settles it here: their notes beside yours, keep yours or theirs.
 */
export function JobNotesForm({ jobId, sheet }: { jobId: number; sheet: JobSheet }) {
  const put = useSheetPut(jobId);
  const queryClient = useQueryClient();
  // The version the notes on screen were written from: taken at the first keystroke after a save.
  const base = useRef<number | null>(null);
  const refused = useOutbox().filter(
    (w) => w.state === 'attention' && w.path === `/api/jobs/${jobId}/notes` && w.problem?.status === 409,
  );
  const slot = useAutosave('notes', () => sheet.notes, {
    label: 'Notes',
    delayMs: 1500,
    parse: (notes: string) => {
      const parsed = jobNotesInputSchema.safeParse({ notes });
      return parsed.success
        ? { ok: true, input: parsed.data.notes }
        : { ok: false, empty: false, errors: { notes: parsed.error.issues[0]?.message ?? 'Too long.' } };
    },
    send: async (notes: string) => {
      const notesVersion = base.current ?? sheet.notesVersion;
      const outcome = await put('/notes', { notes, notesVersion });
      // The next save is written from this one.
      base.current = notesVersion + 1;
      return outcome;
    },
    savedInput: sheet.notes,
  });
  const edit = (notes: string) => {
    if (base.current === null) base.current = sheet.notesVersion;
    slot.edit(notes);
  };
  const stale = slot.status === 'failed' && slot.failure !== null && /Someone else saved the notes/.test(slot.failure);
  const reread = () => queryClient.invalidateQueries({ queryKey: jobQueries.detail(jobId).queryKey });

  // Settled: yours go again on the version now on the server; theirs stay and yours are dropped.
  const keepMine = async (mine: string, write?: QueuedWrite) => {
    await reread();
    if (write) await discardWrite(write);
    const fresh = queryClient.getQueryData(jobQueries.detail(jobId).queryKey)?.sheet.notesVersion;
    base.current = fresh ?? sheet.notesVersion;
    slot.edit(mine);
    void slot.flush();
  };
  const keepTheirs = async (write?: QueuedWrite) => {
    await reread();
    if (write) await discardWrite(write);
    base.current = null;
    const fresh = queryClient.getQueryData(jobQueries.detail(jobId).queryKey)?.sheet;
    slot.settle(fresh?.notes ?? sheet.notes);
  };

  const conflicts: { mine: string; write?: QueuedWrite }[] = [
    ...(stale ? [{ mine: slot.draft }] : []),
    ...refused.map((write) => ({ mine: String((write.body as { notes?: unknown }).notes ?? ''), write })),
  ];
  return (
    <div role="group" aria-label="Notes" className="space-y-2">
      {conflicts.map(({ mine, write }) => (
        <div key={write?.id ?? 'now'} className="space-y-2">
          <Alert tone="error" title="Someone else saved the notes while you were writing">
            Yours were not saved over theirs. Theirs now: &ldquo;{sheet.notes || '(empty)'}&rdquo;. Yours: &ldquo;
            {mine || '(empty)'}&rdquo;.
          </Alert>
          <div className="flex flex-wrap gap-3">
            <Button className="min-h-12" onClick={() => void keepMine(mine, write)}>
              Keep mine
            </Button>
            <Button variant="secondary" className="min-h-12" onClick={() => void keepTheirs(write)}>
              Keep theirs
            </Button>
          </div>
        </div>
      ))}
      <TextareaField
        label="Notes for the record"
        name="notes"
        rows={4}
        hint="What you found and did, and anything the customer or the next engineer should know. Printed on the report."
        readOnly={!sheet.editable}
        value={slot.draft}
        onChange={(e) => edit(e.target.value)}
        onBlur={() => void slot.flush()}
        error={slot.errors.notes}
      />
      {stale ? null : (
        <SavedMark
          status={slot.status}
          stored={slot.stored && slot.draft !== ''}
          kept={slot.kept}
          failure={slot.failure}
          onRetry={() => void slot.flush()}
        />
      )}
    </div>
  );
}
