import { useMemo, useRef, useState, type ReactNode } from 'react';
import { flushSync } from 'react-dom';
import type { JobSheet, SheetRadiator } from '@heatfleet/domain';
import { Button } from '@/components/ui/button';
import { useTickStep } from '@/features/jobs/api/use-job-sheet-mutations';
import { FlushOrderEditor } from '@/features/jobs/components/flush-order-editor';
import { JudgementNote } from '@/features/jobs/components/job-cautions';
import { RadiatorCard, partOfStage } from '@/features/jobs/components/radiator-card';
import { RadiatorList } from '@/features/jobs/components/radiator-list';
import {
  defaultToolId,
  inFlushOrder,
  nextRadiator,
  radiatorAfter,
  radiatorCounts,
  radiatorStage,
  type RadiatorStage,
} from '@/features/jobs/components/radiator-progress';

export function radiatorName(r: SheetRadiator): string {
  return `Radiator ${r.index + 1}: ${r.room}`;
}

/**
 * The radiators: the list is the home, a tap opens one card, and "Next radiator" walks the flush
 * order. Opening a card puts the cursor in the box to fill next, so the keypad is up at once.
 */
export function RadiatorLog({
  jobId,
  sheet,
  timeZone,
  footer,
}: {
  jobId: number;
  sheet: JobSheet;
  timeZone: string;
  /** Shown under the list, not under a card: the radiators' own steps. */
  footer?: ReactNode;
}) {
  const [open, setOpen] = useState<{ index: number; stage: RadiatorStage } | null>(null);
  const [ordering, setOrdering] = useState(false);
  const flushOrder = sheet.flushOrder.radiatorIndexes;
  const root = useRef<HTMLDivElement>(null);
  const tickStep = useTickStep(jobId);
  const ordered = useMemo(() => inFlushOrder(sheet.radiators, flushOrder), [sheet.radiators, flushOrder]);
  if (ordered.length === 0) return <p className="text-ink-muted">The survey lists no radiators.</p>;

  const openRadiator = (index: number | null) => {
    const radiator = ordered.find((r) => r.index === index);
    const stage = radiator ? radiatorStage(radiator) : 'done';
    // Rendered at once, inside the tap, so the phone lets the field take the focus and raise the keypad.
    flushSync(() => setOpen(radiator ? { index: radiator.index, stage } : null));
    const box = root.current;
    if (!box) return;
    box.scrollIntoView({ block: 'start' });
    const part = partOfStage[stage];
    if (radiator && part && sheet.editable) {
      box.querySelector<HTMLElement>(`[data-part="${part}"] input[data-field]`)?.focus({ preventScroll: true });
    }
  };

  // The agitate and flush steps are done when the last radiator is flushed: ticked then, with no tap.
  const afterFlush = (next: JobSheet) => {
    if (!next.radiators.every((r) => r.flushedAt)) return;
    const open = (step: string) => next.steps.some((s) => s.step === step && s.doneAt === null);
    if (open('agitate') && next.radiators.every((r) => r.agitation)) tickStep.mutate({ step: 'agitate', done: true });
    if (open('flush')) tickStep.mutate({ step: 'flush', done: true });
  };

  const current = open ? ordered.find((r) => r.index === open.index) : undefined;
  if (open && current) {
    const next = radiatorAfter(ordered, current.index, open.stage);
    return (
      <div ref={root} className="scroll-mt-4">
        <RadiatorCard
          key={current.index}
          jobId={jobId}
          sheet={sheet}
          radiator={current}
          name={radiatorName(current)}
          position={ordered.indexOf(current) + 1}
          total={ordered.length}
          openedAt={open.stage}
          defaultTool={defaultToolId(ordered, current.index, sheet.kitOnVan)}
          next={next ? { name: radiatorName(next) } : null}
          timeZone={timeZone}
          onNext={() => openRadiator(next?.index ?? null)}
          onClose={() => openRadiator(null)}
          onFlushed={afterFlush}
        />
      </div>
    );
  }
  if (ordering) {
    return <FlushOrderEditor jobId={jobId} ordered={ordered} nameOf={radiatorName} onDone={() => setOrdering(false)} />;
  }
  return (
    <div ref={root} className="scroll-mt-4 space-y-4">
      <RadiatorList
        ordered={ordered}
        counts={radiatorCounts(ordered)}
        next={nextRadiator(ordered)}
        nameOf={radiatorName}
        onOpen={openRadiator}
      />
      {footer}
      {sheet.editable ? (
        <div className="flex flex-wrap items-center gap-3">
          <p className="min-w-0 flex-1 text-sm text-ink-muted">
            {sheet.flushOrder.from === 'site'
              ? 'The flush order is the one kept from the last visit to this site.'
              : 'The flush order is the survey’s until you set it.'}
          </p>
          <Button variant="secondary" className="min-h-12" onClick={() => setOrdering(true)}>
            Set the flush order
          </Button>
        </div>
      ) : null}
      <p className="text-sm text-ink-muted">
        A cold bottom is flagged when the top is more than {sheet.coldBottomThresholdK} K warmer than the bottom (the
        firm&apos;s setting).
      </p>
      <JudgementNote />
    </div>
  );
}

export function radiatorsSummary(sheet: JobSheet): string {
  const counts = radiatorCounts(sheet.radiators);
  return `${counts.flushed} of ${counts.total} flushed · ${counts.after} read after${counts.coldBottom ? ` · ${counts.coldBottom} with a cold bottom` : ''}`;
}
