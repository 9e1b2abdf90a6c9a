import { useState } from 'react';
import {
  completionCodeLabels,
  completionCodes,
  signatureInputSchema,
  type CompletionCode,
  type JobDetail,
} from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextareaField } from '@/components/ui/textarea-field';
import { isApiError } from '@/lib/api-client';
import { useAddSignature, useCompleteJob } from '@/features/jobs/api/use-job-sheet-mutations';
import { useAutosaveStore, useUnsavedSlots } from '@/features/jobs/components/autosave-context';
import { SignatureFields, SignedLine, useSignatureDraft } from '@/features/jobs/components/customer-signature';
import { radiatorCounts } from '@/features/jobs/components/radiator-progress';

interface Issue {
  code: CompletionCode;
  found: string;
}

function isCode(value: string): value is CompletionCode {
  return (completionCodes as readonly string[]).includes(value);
}

/** What the API named in a 422 as needing a reason (details on `confirmations.<code>`). */
function askedFor(error: unknown): Issue[] {
  if (!isApiError(error, 422)) return [];
  return error.details.flatMap((d) => {
    const code = String(d.path).split('.')[1] ?? '';
    return isCode(code) ? [{ code, found: d.message }] : [];
  });
}

/**
 * Completing: whatever is typed and valid is saved first; then a summary of the visit, and only if
 * something is missing (short circulation, no water test, radiators without after readings or flush
 * ticks, input not saved) a reason for each, printed on the report. The customer signs to accept, and
 * completing takes the chemicals off the van.
 */
export function CompleteJobPanel({ detail, timeZone }: { detail: JobDetail; timeZone: string }) {
  const { sheet } = detail;
  const jobId = detail.job.id;
  const [open, setOpen] = useState(false);
  const [flushing, setFlushing] = useState(false);
  const [reasons, setReasons] = useState<Partial<Record<CompletionCode, string>>>({});
  const [showMissing, setShowMissing] = useState(false);
  const [recommendation, setRecommendation] = useState('');
  const [signature, setSignature] = useSignatureDraft(detail.job.site.customerName);
  const store = useAutosaveStore();
  const unsaved = useUnsavedSlots();
  const complete = useCompleteJob(jobId);
  const addSignature = useAddSignature(jobId);
  const accepted = sheet.signatures.find((s) => s.kind === 'acceptance');

  const issues: Issue[] = sheet.completionIssues.filter((i) => i.code !== 'unsaved_input');
  if (unsaved.length) {
    issues.push({ code: 'unsaved_input', found: `Not saved: ${unsaved.map((u) => u.label).join('; ')}.` });
  }
  for (const asked of askedFor(complete.error)) {
    if (!issues.some((i) => i.code === asked.code)) issues.push(asked);
  }
  const reasonOf = (code: CompletionCode) => (reasons[code] ?? '').trim();
  const missingReasons = issues.filter((i) => reasonOf(i.code).length < 3);
  const taking = detail.doses.flatMap((d) =>
    d.takeFromVan.map((a) => `${a.quantity} × ${d.product.name} (lot ${a.lotNumber})`),
  );
  const unticked = sheet.steps.filter((s) => s.doneAt === null);
  const counts = radiatorCounts(sheet.radiators);
  const signing = signatureInputSchema.safeParse({
    kind: 'acceptance',
    name: signature.name,
    imagePngDataUrl: signature.pngDataUrl ?? '',
  });

  const review = () => {
    // Whatever is typed and valid is sent first, so the summary shows only what truly is not saved.
    setFlushing(true);
    void store.flushAll().finally(() => {
      setFlushing(false);
      setOpen(true);
    });
  };

  const submit = async () => {
    await store.flushAll();
    if (missingReasons.length) {
      setShowMissing(true);
      return;
    }
    if (!accepted && signing.success) {
      try {
        await addSignature.mutateAsync(signing.data);
      } catch {
        return;
      }
    }
    const input = {
      confirmations: issues.map((i) => ({ code: i.code, reason: reasonOf(i.code) })),
      ...(unsaved.length ? { unsavedInput: true } : {}),
      ...(recommendation.trim() ? { recommendation: recommendation.trim() } : {}),
    };
    // Its Idempotency-Key and tap time are made now, in the queue: sent again, it completes the job once.
    complete.mutate({ input });
  };

  if (!open) {
    return (
      <div className="space-y-2">
        {detail.doses.some((d) => d.shortfall > 0) ? (
          <p className="text-danger-700">The van is short: restock it before completing.</p>
        ) : null}
        <Button className="min-h-14 w-full text-lg sm:w-auto" busy={flushing} onClick={review}>
          Complete the job
        </Button>
      </div>
    );
  }
  const question = taking.length
    ? `This takes ${taking.join(', ')} off the van. Complete the job?`
    : 'Complete the job?';
  return (
    <div role="group" aria-label="Completion summary" className="space-y-4">
      <ul className="space-y-1">
        {sheet.radiators.length && sheet.visitKind === 'full_clean' ? (
          <li>
            {counts.flushed} of {counts.total} radiators flushed, {counts.after} read after.
          </li>
        ) : null}
        <li>
          {sheet.steps.length - unticked.length} of {sheet.steps.length} steps ticked
          {unticked.length ? `; not ticked: ${unticked.map((s) => s.label).join('; ')}` : ''}.
        </li>
      </ul>
      {issues.length ? (
        <div className="space-y-3 rounded-md border-l-4 border-ember-500 bg-ember-100 p-3">
          <p className="font-semibold text-ember-700">
            Not done: give a reason for each. The reasons are printed on the report.
          </p>
          {issues.map((issue) => (
            <TextareaField
              key={issue.code}
              label={completionCodeLabels[issue.code]}
              name={`reason.${issue.code}`}
              hint={issue.found}
              rows={2}
              className="[&_textarea]:min-h-12"
              value={reasons[issue.code] ?? ''}
              onChange={(e) => setReasons((r) => ({ ...r, [issue.code]: e.target.value }))}
              error={showMissing && reasonOf(issue.code).length < 3 ? 'Give a reason (a few words).' : undefined}
            />
          ))}
        </div>
      ) : (
        <p className="font-semibold text-ok-700">Nothing is missing.</p>
      )}
      <TextareaField
        label="What you recommend (optional)"
        name="recommendation"
        hint="Printed in the result box of the customer's report; left empty, the report says what the results call for."
        rows={2}
        className="[&_textarea]:min-h-12"
        value={recommendation}
        onChange={(e) => setRecommendation(e.target.value)}
      />
      {accepted ? (
        <SignedLine signature={accepted} timeZone={timeZone} />
      ) : (
        <SignatureFields
          kind="acceptance"
          draft={signature}
          onChange={setSignature}
          error={addSignature.error?.message ?? null}
        />
      )}
      <p className="font-semibold">{question}</p>
      <p className="text-ink-muted">
        Once completed, the job sheet can no longer change, and the report is e-mailed to the customer if they have an
        address.
      </p>
      {complete.isError ? <Alert tone="error">{complete.error.message}</Alert> : null}
      {complete.isSuccess && complete.data === null ? (
        <Alert tone="info">
          No signal: the completion is saved on this phone and goes when the signal returns. If the server cannot
          complete it then, it appears under &ldquo;needs your attention&rdquo; with the reason.
        </Alert>
      ) : null}
      <div className="flex flex-wrap gap-3">
        <Button
          className="min-h-14 flex-1 text-lg"
          busy={complete.isPending || addSignature.isPending}
          onClick={() => void submit()}
        >
          Yes, complete it
        </Button>
        <Button variant="secondary" className="min-h-14" disabled={complete.isPending} onClick={() => setOpen(false)}>
          Not yet
        </Button>
      </div>
    </div>
  );
}
