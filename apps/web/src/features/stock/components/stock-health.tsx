import { formatPacks, stockHealthLabels, type StockHealth } from '@heatfleet/domain';

export type { StockHealth };

// Our palette, with a second cue (the mark) so health never rests on colour alone.
export const healthStyles: Record<StockHealth, { cell: string; mark: string }> = {
  ok: { cell: 'bg-ok-50 text-ok-700 border-ok-700/30', mark: '●' },
  below_target: { cell: 'bg-ember-100 text-ember-700 border-ember-700/30', mark: '◐' },
  below_minimum: { cell: 'bg-danger-50 text-danger-700 border-danger-700/40', mark: '▼' },
  short_for_jobs: { cell: 'bg-danger-50 text-danger-700 border-danger-700', mark: '!' },
  empty: { cell: 'bg-danger-700 text-white border-danger-700', mark: '✕' },
  no_par: { cell: 'bg-card text-ink-muted border-line', mark: '–' },
};

export function HealthBadge({ health }: { health: StockHealth }) {
  const style = healthStyles[health];
  return (
    <span
      className={`inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-sm font-semibold whitespace-nowrap ${style.cell}`}
    >
      <span aria-hidden="true">{style.mark}</span>
      {stockHealthLabels[health]}
    </span>
  );
}

const legendOrder: StockHealth[] = ['ok', 'below_target', 'below_minimum', 'short_for_jobs', 'empty', 'no_par'];

export function HealthLegend() {
  return (
    <ul aria-label="What the colours mean" className="flex flex-wrap gap-2">
      {legendOrder.map((health) => (
        <li key={health}>
          <HealthBadge health={health} />
        </li>
      ))}
    </ul>
  );
}

export function packsText(n: number): string {
  return `${n} pack${n === 1 ? '' : 's'}`;
}

/** Packs with their size, the way every stock screen writes a count: "3 packs of 1 L". */
export function packsOf(n: number, packSizeMl: number | undefined): string {
  return packSizeMl ? formatPacks(n, packSizeMl) : packsText(n);
}
