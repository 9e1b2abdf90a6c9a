import { useState } from 'react';
import type { SheetRadiator } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { useSetFlushOrder } from '@/features/jobs/api/use-job-sheet-mutations';

/**
 * The flush order, set once by numbering: tap the radiators in the order they will be flushed (the
 * furthest from the rig first). Any not tapped keep their order after the numbered ones. Saved on the
 * site, so the next visit starts with it.
 */
export function FlushOrderEditor({
  jobId,
  ordered,
  nameOf,
  onDone,
}: {
  jobId: number;
  ordered: readonly SheetRadiator[];
  nameOf: (r: SheetRadiator) => string;
  onDone: () => void;
}) {
  const [picked, setPicked] = useState<number[]>([]);
  const save = useSetFlushOrder(jobId);
  const rest = ordered.filter((r) => !picked.includes(r.index));
  const order = [...picked, ...rest.map((r) => r.index)];
  const toggle = (index: number) =>
    setPicked((p) => (p.includes(index) ? p.filter((i) => i !== index) : [...p, index]));
  return (
    <div role="group" aria-label="Flush order" className="space-y-3">
      <p className="font-semibold">
        Tap the radiators in the order you will flush them, the furthest from the rig first. Tap again to take a number
        off.
      </p>
      <ol className="space-y-2">
        {ordered.map((r) => {
          const n = picked.indexOf(r.index);
          return (
            <li key={r.index}>
              <button
                type="button"
                aria-pressed={n >= 0}
                onClick={() => toggle(r.index)}
                className="flex min-h-12 w-full items-center gap-3 rounded-lg border-2 border-line-strong bg-card px-3 text-left aria-pressed:border-brand-700 aria-pressed:bg-brand-50"
              >
                <span
                  aria-hidden="true"
                  className="grid size-8 shrink-0 place-items-center rounded-md border-2 border-brand-700 font-bold text-brand-800 tabular-nums"
                >
                  {n >= 0 ? n + 1 : ''}
                </span>
                <span className="font-semibold">{nameOf(r)}</span>
              </button>
            </li>
          );
        })}
      </ol>
      {save.isError ? <Alert tone="error">{save.error.message}</Alert> : null}
      <div className="flex flex-wrap gap-3">
        <Button
          className="min-h-12 flex-1"
          busy={save.isPending}
          disabled={picked.length === 0}
          onClick={() => save.mutate(order, { onSuccess: onDone })}
        >
          Save this order
        </Button>
        <Button variant="secondary" className="min-h-12" onClick={onDone}>
          Keep the order
        </Button>
      </div>
    </div>
  );
}
