import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { useIdempotencyKey } from '@/lib/idempotency';
import type { JobDetail } from '@/features/jobs/api/job-queries';
import { useCompleteJob } from '@/features/jobs/api/use-job-mutations';

/** Completing takes the chemicals off the van, so it asks once more before sending. */
export function CompleteJobPanel({ detail }: { detail: JobDetail }) {
  const [confirming, setConfirming] = useState(false);
  const complete = useCompleteJob(detail.job.id);
  const idempotency = useIdempotencyKey();
  const short = detail.doses.some((d) => d.shortfall > 0);
  const taking = detail.doses.flatMap((d) => d.takeFromVan.map((a) => `${a.quantity} × ${d.product.name} (lot ${a.lotNumber})`));

  if (!confirming) {
    return (
      <div className="space-y-2">
        {short ? <p className="text-danger-700">The van is short: restock it before completing.</p> : null}
        <Button className="w-full sm:w-auto" onClick={() => setConfirming(true)}>
          Complete the job
        </Button>
      </div>
    );
  }
  return (
    <div className="space-y-3 rounded-md border border-line-strong p-4">
      <p className="font-semibold">
        {taking.length ? `This takes ${taking.join(', ')} off the van. Complete the job?` : 'Complete the job?'}
      </p>
      {complete.isError ? <Alert tone="error">{complete.error.message}</Alert> : null}
      <div className="flex flex-wrap gap-3">
        <Button
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
        <Button variant="secondary" disabled={complete.isPending} onClick={() => setConfirming(false)}>
          Not yet
        </Button>
      </div>
    </div>
  );
}
