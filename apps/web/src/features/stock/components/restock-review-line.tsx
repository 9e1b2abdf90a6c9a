import type { RestockRunLine, RestockRunNamedLine } from '@heatfleet/domain';
import { NumberField } from '@/components/ui/number-field';
import { formatCalendarDate } from '@/lib/format';
import { packsOf } from '@/features/stock/components/stock-health';

export interface Reviewed {
  /** Packs to send, as typed ('' while being typed). */
  packs: string;
  dropped: boolean;
}

export const suggestedPacks = (line: RestockRunLine) => line.allocations.reduce((n, a) => n + a.quantity, 0);

/** Whole packs from 1 up; anything else is not a quantity to send. */
export function reviewedPacks(r: Reviewed): number | null {
  if (r.dropped) return 0;
  const n = Number(r.packs);
  return r.packs.trim() !== '' && Number.isInteger(n) && n >= 0 ? n : null;
}

/** One product for one van in the review: what it holds and needs, the lots suggested, the packs to send. */
export function RestockReviewLine({
  line,
  reviewed,
  onChange,
}: {
  line: RestockRunNamedLine;
  reviewed: Reviewed;
  onChange: (next: Reviewed) => void;
}) {
  const size = line.product.packSizeMl;
  const suggested = suggestedPacks(line);
  const packs = reviewedPacks(reviewed);
  const changed = packs !== null && packs !== suggested && !reviewed.dropped;
  const label = `${line.product.name} for ${line.van.name}`;
  return (
    <li
      className={`space-y-2 border-b border-line py-3 last:border-b-0 print:break-inside-avoid ${reviewed.dropped ? 'opacity-60 print:hidden' : ''}`}
    >
      <div className="flex flex-wrap items-baseline justify-between gap-x-3">
        <p className="font-semibold [overflow-wrap:anywhere]">{line.product.name}</p>
        <p className="text-sm text-ink-muted">
          has {line.usable}, target {line.need.target}
          {line.booked > 0 ? ` (booked jobs need ${line.booked}, minimum ${line.need.minimum})` : ''}
        </p>
      </div>
      <ul className="text-sm" aria-label={`Lots for ${label}`}>
        {line.allocations.map((a) => (
          <li key={a.batchId}>
            <span className="font-mono">{a.lotNumber}</span>{' '}
            <span className="whitespace-nowrap text-ink-muted">use by {formatCalendarDate(a.expiresOn)}</span>:{' '}
            <strong>{packsOf(a.quantity, size)}</strong>
          </li>
        ))}
        {line.shortfall > 0 ? (
          <li className="font-semibold text-danger-700">
            Short by {packsOf(line.shortfall, size)}: the depot has no more usable stock of it.
          </li>
        ) : null}
      </ul>
      <div className="flex flex-wrap items-end gap-3 print:hidden">
        <NumberField
          label={`Packs of ${label}`}
          name={`packs-${line.van.id}-${line.product.id}`}
          whole
          min={0}
          value={reviewed.packs}
          disabled={reviewed.dropped}
          onValueChange={(value) => onChange({ ...reviewed, packs: value })}
          error={packs === null ? 'Enter whole packs.' : undefined}
          className="w-40"
        />
        <label className="inline-flex min-h-12 cursor-pointer items-center gap-2 font-semibold">
          <input
            type="checkbox"
            className="size-6 accent-brand-700"
            checked={reviewed.dropped}
            onChange={(event) => onChange({ ...reviewed, dropped: event.target.checked })}
          />
          Drop {label}
        </label>
      </div>
      {changed ? (
        <p className="text-sm text-ink-muted print:hidden">
          Changed from {suggested}: the lots are chosen first expiry first when the run is applied.
        </p>
      ) : null}
      <p className="hidden print:block">Pick {packsOf(packs ?? 0, size)} ☐</p>
    </li>
  );
}
