import type { SheetRadiator } from '@heatfleet/domain';
import { radiatorStage, stageWords, type RadiatorCounts } from '@/features/jobs/components/radiator-progress';
import { panelLabel } from '@/features/jobs/components/survey-draft';

const chips = [
  ['before', 'Before', (r: SheetRadiator) => r.before !== null],
  ['agitated', 'Agitated', (r: SheetRadiator) => r.agitation !== null],
  ['flushed', 'Flushed', (r: SheetRadiator) => r.flushedAt !== null],
  ['after', 'After', (r: SheetRadiator) => r.after !== null],
] as const;

function Chips({ radiator }: { radiator: SheetRadiator }) {
  return (
    <span className="grid grid-cols-4 gap-1">
      {chips.map(([key, word, done]) =>
        done(radiator) ? (
          <span key={key} className="rounded-full bg-ok-700 py-0.5 text-center text-sm font-semibold text-white">
            {word}
            <span className="sr-only"> done,</span>
          </span>
        ) : (
          <span key={key} className="rounded-full border border-line-strong py-0.5 text-center text-sm text-ink-muted">
            {word}
            <span className="sr-only"> not yet,</span>
          </span>
        ),
      )}
    </span>
  );
}

/**
 * The sheet's home: every radiator in the flush order with a chip per part, the count, and the next
 * one first as the biggest target. A tap opens that radiator's card.
 */
export function RadiatorList({
  ordered,
  counts,
  next,
  nameOf,
  onOpen,
}: {
  ordered: readonly SheetRadiator[];
  counts: RadiatorCounts;
  next: SheetRadiator | null;
  nameOf: (r: SheetRadiator) => string;
  onOpen: (index: number) => void;
}) {
  return (
    <div className="space-y-3">
      <p role="status" aria-label="Radiator count" className="text-lg font-bold text-brand-900 tabular-nums">
        {counts.flushed} of {counts.total} flushed
        <span className="block text-base font-normal text-ink-muted">
          {counts.before} read before · {counts.after} read after
          {counts.coldBottom ? ` · ${counts.coldBottom} with a cold bottom` : ''}
        </span>
      </p>
      {next ? (
        <button
          type="button"
          onClick={() => onOpen(next.index)}
          className="flex min-h-16 w-full flex-col items-start justify-center rounded-lg bg-brand-700 px-4 py-2 text-left text-white"
        >
          <span className="text-lg font-bold">Next: {nameOf(next)}</span>
          <span className="text-brand-100">{stageWords[radiatorStage(next)]}</span>
        </button>
      ) : (
        <p className="rounded-lg border-2 border-ok-700 bg-ok-50 px-4 py-3 font-semibold text-ok-700">
          Every radiator is read before, flushed and read after.
        </p>
      )}
      <ol aria-label="Radiators in the flush order" className="space-y-2">
        {ordered.map((r, i) => (
          <li key={r.index}>
            <button
              type="button"
              onClick={() => onOpen(r.index)}
              className="block min-h-14 w-full space-y-1 rounded-lg border-2 border-line-strong bg-card px-2 py-2 text-left"
            >
              <span className="flex items-center gap-2">
                <span
                  aria-hidden="true"
                  className="grid size-7 shrink-0 place-items-center rounded-md bg-brand-50 font-bold text-brand-800 tabular-nums"
                >
                  {i + 1}
                </span>
                <span className="min-w-0 truncate font-semibold">
                  {r.room} <span className="font-normal text-ink-muted">· {panelLabel(r.panel)}</span>
                </span>
              </span>
              <Chips radiator={r} />
            </button>
          </li>
        ))}
      </ol>
    </div>
  );
}
