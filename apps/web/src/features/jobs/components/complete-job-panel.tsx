import { useState } from 'react';
import type { JobDetail } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { useIdempotencyKey } from '@/lib/idempotency';
import { useCompleteJob } from '@/features/jobs/api/use-job-mutations';

/** Completing takes the chemicals off the van, so it asks once more before sending. */
export function CompleteJobPanel({ detail }: { detail: JobDetail }) {
  const [confirming, setConfirming] = useState(false);
  const complete = useCompleteJob(detail.job.id);
  const idempotency = useIdempotencyKey();
  const short = detail.doses.some((d) => d.shortfall > 0);
  const taking = detail.doses.flatMap((d) =>
    d.takeFromVan.map((a) => `${a.quantity} × ${d.product.name} (lot ${a.lotNumber})`),
  );
  // Not a bar to completing (a step may not apply on every system), but worth a second look first.
  const unticked = detail.sheet.steps.filter((s) => s.doneAt === null);
  const untickedNote = unticked.length ? (
    <p className="rounded-md bg-ember-100 px-3 py-2 text-ember-700">
      Not ticked yet: {unticked.map((s) => s.label).join('; ')}.
    </p>
  ) : null;

  if (!confirming) {
    return (
      <div className="space-y-2">
        {short ? <p className="text-danger-700">The van is short: restock it before completing.</p> : null}
        {untickedNote}
        <Button className="min-h-12 w-full sm:w-auto" onClick={() => setConfirming(true)}>
          Complete the job
        </Button>
      </div>
    );
  }
  return (
    <div className="space-y-3 rounded-md border border-line-strong p-4">
      {untickedNote}
      <p className="font-semibold">
        {taking.length ? `This takes ${taking.join(', ')} off the van. Complete the job?` : 'Complete the job?'}
      </p>
      <p className="text-ink-muted">
        Once completed, the job sheet can no longer change, and the report is e-mailed to the customer if they have an
        address.
      </p>
      {complete.isError ? <Alert tone="error">{complete.error.message}</Alert> : null}
      <div className="flex flex-wrap gap-3">
        <Button
          className="min-h-12"
          busy={complete.isPending}
          onClick={() =>
            complete.mutate(
              { idempotencyKey: idempotency.keyFor({ complete: detail.job.id }) },
              {
                onSuccess: () => {
                  idempotency.done();
                  setConfirming(false);
                },
              },
            )
          }
        >
          Yes, complete it
        </Button>
        <Button
          variant="secondary"
          className="min-h-12"
          disabled={complete.isPending}
          onClick={() => setConfirming(false)}
        >
          Not yet
        </Button>
      </div>
    </div>
  );
}
