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
  onTicked,
}: {
  jobId: number;
  radiator: SheetRadiator;
  sheet: JobSheet;
  timeZone: string;
  /** With the sheet the tick answered, e.g. to tick the flush step once every radiator is flushed. */
  onTicked?: (sheet: JobSheet) => void;
}) {
  const tick = useTickFlushed(jobId);
  const busy = tick.isPending && tick.variables.index === radiator.index;
  const done = radiator.flushedAt !== null;
  return (
    <div className="space-y-2">
      {sheet.editable && !done ? (
        <Button
          variant="secondary"
          data-field=""
          className="min-h-14 w-full border-2 border-brand-700 text-lg"
          busy={busy}
          onClick={() => tick.mutate({ index: radiator.index, done: true }, { onSuccess: onTicked })}
        >
          Flushed until clear
        </Button>
      ) : (
        <div className="flex flex-wrap items-center gap-2">
          <p
            className={`flex min-h-12 flex-1 items-center gap-2 rounded-lg border-2 px-3 ${done ? 'border-ok-700 bg-ok-50' : 'border-line text-ink-muted'}`}
          >
            {done
              ? `✓ Flushed until clear at ${formatClock(radiator.flushedAt!, timeZone)}`
              : 'Not recorded as flushed.'}
          </p>
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
        </div>
      )}
      {tick.isError && tick.variables.index === radiator.index ? (
        <p role="alert" className="font-semibold text-ember-700">
          {tick.error.message}
        </p>
      ) : null}
    </div>
  );
}
