import type { JobDetail } from '@heatfleet/domain';
import { formatCalendarDate } from '@/lib/format';

export function ChemicalsUsed({ used }: { used: JobDetail['chemicalsUsed'] }) {
  if (used.length === 0) return <p className="text-ink-muted">No chemicals were taken off the van for this job.</p>;
  return (
    <ul className="divide-y divide-line rounded-md border border-line" aria-label="Chemicals used">
      {used.map((row) => (
        <li key={`${row.product}-${row.lotNumber}`} className="px-3 py-2">
          <span className="font-semibold">
            {row.packs} × {row.product}
          </span>{' '}
          <span className="text-ink-muted">
            lot <span className="font-mono">{row.lotNumber}</span>, use by {formatCalendarDate(row.expiresOn)}
          </span>
        </li>
      ))}
    </ul>
  );
}
