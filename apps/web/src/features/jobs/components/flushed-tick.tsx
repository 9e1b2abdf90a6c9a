import type { JobSheet, SheetRadiator } from '@heatfleet/domain';
import { Button } from '@/components/ui/button';
import { useTickFlushed } from '@/features/jobs/api/use-job-sheet-mutations';
import { formatClock } from '@/features/jobs/components/sheet-format';

/** Flushed until clear, ticked radiator by radiator: the flush step's record for each one. */
export function FlushedTick({
  jobId,
  radiator,
  sheet,
  timeZone,
}: {
  jobId: number;
  radiator: SheetRadiator;
  sheet: JobSheet;
  timeZone: string;
}) {
  const tick = useTickFlushed(jobId);
  const busy = tick.isPending && tick.variables.index === radiator.index;
  const done = radiator.flushedAt !== null;
  return (
    <div className="space-y-2">
      {sheet.editable && !done ? (
        <Button
          variant="secondary"
          className="min-h-12 w-full"
          busy={busy}
          onClick={() => tick.mutate({ index: radiator.index, done: true })}
        >
          Flushed until clear
        </Button>
      ) : (
        <p
          className={`flex min-h-12 items-center gap-2 rounded-lg border-2 px-3 ${done ? 'border-ok-700 bg-ok-50' : 'border-line text-ink-muted'}`}
        >
          {done ? `✓ Flushed until clear at ${formatClock(radiator.flushedAt!, timeZone)}` : 'Not recorded as flushed.'}
        </p>
      )}
      {sheet.editable && done ? (
        <Button
          variant="secondary"
          className="min-h-12"
          busy={busy}
          aria-label={`Untick flushed: radiator ${radiator.index + 1}`}
          onClick={() => tick.mutate({ index: radiator.index, done: false })}
        >
          Untick
        </Button>
      ) : null}
      {tick.isError && tick.variables.index === radiator.index ? (
        <p role="alert" className="font-semibold text-ember-700">
          {tick.error.message}
        </p>
      ) : null}
    </div>
  );
}
