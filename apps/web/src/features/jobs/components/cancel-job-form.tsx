import { useState } from 'react';
import { cancelJobInputSchema } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextareaField } from '@/components/ui/textarea-field';
import { useCancelJob } from '@/features/jobs/api/use-job-mutations';

/** Cancelling a booked job asks why; the reason is kept with who cancelled and when. */
export function CancelJobForm({ jobId }: { jobId: number }) {
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | undefined>();
  const cancel = useCancelJob(jobId);
  const submit = () => {
    const parsed = cancelJobInputSchema.safeParse({ reason });
    if (!parsed.success) return setError(parsed.error.issues[0]?.message);
    setError(undefined);
    cancel.mutate(parsed.data);
  };
  return (
    <div role="group" aria-label="Cancel the job" className="space-y-3 border-t border-line pt-4">
      <TextareaField
        label="Why is the job cancelled?"
        name="cancel.reason"
        rows={2}
        className="[&_textarea]:min-h-12"
        value={reason}
        onChange={(e) => setReason(e.target.value)}
        error={error}
      />
      {cancel.isError ? <Alert tone="error">{cancel.error.message}</Alert> : null}
      <Button variant="danger" className="min-h-12 w-full" busy={cancel.isPending} onClick={submit}>
        Cancel the job
      </Button>
    </div>
  );
}
