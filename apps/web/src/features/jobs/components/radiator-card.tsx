import type { ReactNode } from 'react';
import type { JobSheet, SheetRadiator } from '@heatfleet/domain';
import { Button } from '@/components/ui/button';
import { AgitationFields, agitationSummary } from '@/features/jobs/components/agitation-fields';
import { FlushedTick } from '@/features/jobs/components/flushed-tick';
import { radiatorStage, stageRank, type RadiatorStage } from '@/features/jobs/components/radiator-progress';
import { ReadingFields, readingSummary, watts } from '@/features/jobs/components/reading-fields';
import { formatClock } from '@/features/jobs/components/sheet-format';
import { panelLabel } from '@/features/jobs/components/survey-draft';

export type CardPart = 'before' | 'clean' | 'after';
export const partOfStage: Record<RadiatorStage, CardPart | null> = {
  before: 'before',
  agitate: 'clean',
  flush: 'clean',
  after: 'after',
  done: null,
};

/** "before 62/38 °C, cold bottom · 5 min · flushed 14:12 · after 64/61 °C": the radiator on one line. */
export function radiatorLine(r: SheetRadiator, timeZone: string): string {
  return [
    r.before ? `before ${readingSummary(r.before)}` : null,
    r.agitation ? agitationSummary(r.agitation) : null,
    r.flushedAt ? `flushed ${formatClock(r.flushedAt, timeZone)}` : null,
    r.after ? `after ${readingSummary(r.after)}` : null,
  ]
    .filter(Boolean)
    .join(' · ');
}

function Part({
  part,
  title,
  summary,
  done,
  open,
  children,
}: {
  part: CardPart;
  title: string;
  summary: string;
  done: boolean;
  open: boolean;
  children: ReactNode;
}) {
  return (
    <details
      open={open}
      data-part={part}
      className={`group/part rounded-lg border-2 ${done ? 'border-ok-700' : 'border-line-strong'}`}
    >
      <summary className="flex min-h-12 cursor-pointer list-none items-center justify-between gap-3 px-3 py-1 [&::-webkit-details-marker]:hidden">
        <span className="font-bold">
          {done ? (
            <span aria-hidden="true" className="text-ok-700">
              ✓{' '}
            </span>
          ) : null}
          {title}
        </span>
        <span className="min-w-0 truncate text-right text-sm text-ink-muted group-open/part:hidden">{summary}</span>
      </summary>
      {/* One scope per part: Enter in its last box moves on to what follows in it, then to "Next radiator". */}
      <div data-field-scope="" className="space-y-3 px-3 pb-3">
        {children}
      </div>
    </details>
  );
}

/**
 * One radiator: before readings, agitation and flush, after readings. The part the radiator is at is
 * open; finished parts fold into one line (a tap opens them again). Every field saves on its own.
 */
export function RadiatorCard({
  jobId,
  sheet,
  radiator,
  name,
  position,
  total,
  openedAt,
  defaultTool,
  next,
  timeZone,
  onNext,
  onClose,
  onFlushed,
}: {
  jobId: number;
  sheet: JobSheet;
  radiator: SheetRadiator;
  name: string;
  position: number;
  total: number;
  /** The stage the radiator was at when the card opened: that part is open, and stays open. */
  openedAt: RadiatorStage;
  defaultTool: number | null;
  next: { name: string } | null;
  timeZone: string;
  onNext: () => void;
  onClose: () => void;
  onFlushed: (sheet: JobSheet) => void;
}) {
  const stage = radiatorStage(radiator);
  const openPart = partOfStage[openedAt];
  const line = radiatorLine(radiator, timeZone);
  return (
    <section
      role="group"
      aria-label={name}
      data-field-end-scope=""
      className="space-y-3 rounded-xl border-2 border-brand-700 bg-card p-3"
    >
      <div className="flex items-start justify-between gap-3">
        <div className="min-w-0">
          <h3 className="text-lg font-bold text-brand-900">{name}</h3>
          <p className="text-sm text-ink-muted">
            {panelLabel(radiator.panel)}
            {radiator.ratedWatts ? ` · rated ${watts.format(radiator.ratedWatts)} W` : ''} · {position} of {total} in
            the flush order
          </p>
        </div>
        <Button variant="secondary" className="min-h-12 shrink-0" onClick={onClose}>
          All radiators
        </Button>
      </div>
      {line ? <p className="text-sm font-semibold text-ink">{line}</p> : null}
      <Part
        part="before"
        title="Before the clean"
        summary={readingSummary(radiator.before)}
        done={radiator.before !== null}
        open={openPart === 'before'}
      >
        <ReadingFields jobId={jobId} radiator={radiator} phase="before" sheet={sheet} name={name} />
      </Part>
      <Part
        part="clean"
        title="Agitate and flush"
        summary={
          radiator.flushedAt
            ? `${agitationSummary(radiator.agitation)} · flushed ${formatClock(radiator.flushedAt, timeZone)}`
            : radiator.agitation
              ? `${agitationSummary(radiator.agitation)} · not flushed`
              : 'not yet'
        }
        done={radiator.flushedAt !== null}
        open={openPart === 'clean'}
      >
        <AgitationFields jobId={jobId} radiator={radiator} sheet={sheet} name={name} defaultTool={defaultTool} />
        <FlushedTick jobId={jobId} radiator={radiator} sheet={sheet} timeZone={timeZone} onTicked={onFlushed} />
      </Part>
      <Part
        part="after"
        title="After the clean"
        summary={radiator.after ? readingSummary(radiator.after) : stageRank[stage] < 3 ? 'not yet' : 'not taken'}
        done={radiator.after !== null}
        open={openPart === 'after'}
      >
        <ReadingFields jobId={jobId} radiator={radiator} phase="after" sheet={sheet} name={name} />
      </Part>
      <Button data-field-end="" className="min-h-14 w-full text-lg" onClick={next ? onNext : onClose}>
        {next ? `Next radiator: ${next.name}` : 'Every radiator done: back to the list'}
      </Button>
    </section>
  );
}
