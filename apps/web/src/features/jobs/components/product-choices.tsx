import { useId } from 'react';
import type { VisitKind } from '@heatfleet/domain';
import type { DoseProduct } from '@/features/jobs/components/live-plan-panel';

/** The firm's first active cleaner and inhibitor by name, pre-chosen (an inhibitor visit takes no cleaner). */
export function defaultProductIds(products: readonly DoseProduct[], visitKind: VisitKind): number[] {
  const first = (kind: string) =>
    [...products].filter((p) => p.kind === kind).sort((a, b) => a.name.localeCompare(b.name))[0];
  return [visitKind === 'full_clean' ? first('cleaner') : undefined, first('inhibitor')]
    .filter((p): p is DoseProduct => p !== undefined)
    .map((p) => p.id);
}

/** The products to dose: shown in a line, changed in the fold. */
export function ProductChoices({
  products,
  visitKind,
  chosen,
  onChange,
}: {
  products: DoseProduct[];
  visitKind: VisitKind;
  chosen: number[];
  onChange: (ids: number[]) => void;
}) {
  const id = useId();
  const offered = products.filter((p) => visitKind === 'full_clean' || p.kind !== 'cleaner');
  const names = offered.filter((p) => chosen.includes(p.id)).map((p) => p.name);
  return (
    <details className="rounded-lg border-2 border-line-strong">
      <summary className="flex min-h-12 cursor-pointer list-none flex-col justify-center px-3 py-2 [&::-webkit-details-marker]:hidden">
        <span className="font-bold text-brand-900">Products to dose</span>
        <span className="text-sm text-ink-muted">{names.length ? names.join(', ') : 'None chosen'}</span>
      </summary>
      <fieldset className="space-y-2 px-3 pb-3">
        <legend className="sr-only">Products to dose</legend>
        {offered.length === 0 ? (
          <p className="text-ink-muted">The firm has no cleaner or inhibitor set up yet.</p>
        ) : null}
        {offered.map((p) => (
          <label
            key={p.id}
            htmlFor={`${id}-${p.id}`}
            className="flex min-h-12 cursor-pointer items-center gap-3 rounded-lg border-2 border-line-strong px-3 has-[:checked]:border-brand-700 has-[:checked]:bg-brand-50"
          >
            <input
              id={`${id}-${p.id}`}
              type="checkbox"
              className="size-6 accent-brand-700"
              checked={chosen.includes(p.id)}
              onChange={(e) => onChange(e.target.checked ? [...chosen, p.id] : chosen.filter((c) => c !== p.id))}
            />
            <span className="font-semibold">
              {p.name} <span className="font-normal text-ink-muted">({p.kind})</span>
            </span>
          </label>
        ))}
      </fieldset>
    </details>
  );
}
