import { useMemo, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import {
  restockRunNamedLines,
  type RestockRun,
  type RestockRunLine,
  type RestockRunNamedLine,
} from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { formatCalendarDate } from '@/lib/format';
import { useIdempotencyKey } from '@/lib/idempotency';
import { stockQueries } from '@/features/stock/api/stock-queries';
import { useApplyRestockRun } from '@/features/stock/api/use-stock-movement';
import {
  RestockReviewLine,
  reviewedPacks,
  suggestedPacks,
  type Reviewed,
} from '@/features/stock/components/restock-review-line';
import { packsText } from '@/features/stock/components/stock-health';

const lineKey = (line: RestockRunLine) => `${line.locationId}:${line.productId}`;

function byVan(lines: RestockRunNamedLine[]) {
  const vans = new Map<number, { van: RestockRunNamedLine['van']; lines: RestockRunNamedLine[] }>();
  for (const line of lines) {
    const entry = vans.get(line.van.id) ?? { van: line.van, lines: [] };
    entry.lines.push(line);
    vans.set(line.van.id, entry);
  }
  return [...vans.values()].sort((a, b) => a.van.name.localeCompare(b.van.name, 'en-GB', { numeric: true }));
}

/** The lines the server gets: a line as suggested keeps its lots; a changed one is taken first expiry first. */
function reviewedTransfers(lines: RestockRunNamedLine[], review: Record<string, Reviewed>) {
  return lines.flatMap((line) => {
    const r = review[lineKey(line)];
    const packs = r ? reviewedPacks(r) : suggestedPacks(line);
    if (!packs) return [];
    if (packs === suggestedPacks(line))
      return line.allocations.map((a) => ({
        toLocationId: line.van.id,
        productId: line.product.id,
        batchId: a.batchId,
        quantity: a.quantity,
      }));
    return [{ toLocationId: line.van.id, productId: line.product.id, quantity: packs }];
  });
}

type Apply = ReturnType<typeof useApplyRestockRun>;

function Review({
  run,
  canApply,
  apply,
  setApplied,
}: {
  run: RestockRun;
  canApply: boolean;
  apply: Apply;
  setApplied: (message: string | null) => void;
}) {
  const idempotency = useIdempotencyKey();
  const [review, setReview] = useState<Record<string, Reviewed>>(() =>
    Object.fromEntries(run.lines.map((l) => [lineKey(l), { packs: String(suggestedPacks(l)), dropped: false }])),
  );
  const { depot, today } = run;
  // The answer names each van and product once; the review shows them on every line.
  const lines = useMemo(() => restockRunNamedLines(run), [run]);
  const vans = byVan(lines);
  const invalid = lines.some((l) => reviewedPacks(review[lineKey(l)]!) === null);
  const transfers = reviewedTransfers(lines, review);
  const totalPacks = transfers.reduce((n, t) => n + t.quantity, 0);
  const vanCount = new Set(transfers.map((t) => t.toLocationId)).size;
  const dropped = lines.filter((l) => review[lineKey(l)]?.dropped).length;
  const shortLines = lines.filter((line) => line.shortfall > 0);

  return (
    <div className="space-y-4">
      <p className="hidden print:block">
        Pick list from {depot.name}, {formatCalendarDate(today)}
      </p>
      <p className="print:hidden">
        From <strong>{depot.name}</strong>, first expiry first. Each van is filled to its target, or to what its booked
        jobs of the next {run.restockDays} days need plus its minimum if that is more. Change or drop any line, then
        apply what you reviewed.
        {shortLines.length > 0
          ? ` ${shortLines.length} line${shortLines.length === 1 ? ' is' : 's are'} short: the depot does not hold enough.`
          : ''}
      </p>
      <ol className="space-y-4 print:space-y-2" aria-label="Pick list by van">
        {vans.map(({ van, lines: vanLines }) => (
          <li
            key={van.id}
            className="rounded-xl border border-line bg-card p-4 print:break-inside-avoid print:rounded-none print:border-ink print:p-2"
          >
            <h3 className="text-lg font-bold text-brand-900 print:text-black">
              {van.name}{' '}
              {van.registration ? <span className="font-mono text-base font-normal">{van.registration}</span> : null}
            </h3>
            <ul aria-label={`Lines for ${van.name}`}>
              {vanLines.map((line) => (
                <RestockReviewLine
                  key={lineKey(line)}
                  line={line}
                  reviewed={review[lineKey(line)]!}
                  onChange={(next) => {
                    setApplied(null);
                    setReview((r) => ({ ...r, [lineKey(line)]: next }));
                  }}
                />
              ))}
            </ul>
          </li>
        ))}
      </ol>
      <section
        aria-label="Apply the reviewed run"
        className="sticky bottom-0 space-y-2 border-t-2 border-line bg-canvas py-3 print:hidden"
      >
        <p className="font-semibold">
          Reviewed: {packsText(totalPacks)} to {vanCount} van{vanCount === 1 ? '' : 's'}
          {dropped > 0 ? `, ${dropped} line${dropped === 1 ? '' : 's'} dropped` : ''}.
        </p>
        <div className="flex flex-col gap-2 sm:flex-row">
          {canApply ? (
            <Button
              busy={apply.isPending}
              disabled={transfers.length === 0 || invalid}
              className="min-h-14 text-lg sm:min-w-48"
              onClick={() => {
                setApplied(null);
                const body = { lines: transfers };
                // Awaited: applying recomputes the run, which remounts this review before a callback could run.
                void apply.mutateAsync({ ...body, idempotencyKey: idempotency.keyFor(body) }).then(
                  () => {
                    idempotency.done();
                    setApplied(
                      `Applied: ${packsText(totalPacks)} moved from ${depot.name} to ${vanCount} van${vanCount === 1 ? '' : 's'}.`,
                    );
                  },
                  () => undefined, // shown from apply.error above the review
                );
              }}
            >
              Apply reviewed run
            </Button>
          ) : null}
          <Button variant="secondary" className="min-h-14" onClick={() => window.print()}>
            Print pick list
          </Button>
        </div>
      </section>
    </div>
  );
}

/**
 * The restock run as a review: per van, what to take from which lot, each line changeable or dropped,
 * then applied as reviewed in one step (all the transfers, or none if stock moved meanwhile).
 */
export function RestockRunPlan({ canApply }: { canApply: boolean }) {
  const run = useQuery(stockQueries.restockRun());
  // Kept here, above the review: applying recomputes the run, which starts a fresh review.
  const apply = useApplyRestockRun();
  const [applied, setApplied] = useState<string | null>(null);
  if (run.isPending) return <PageSpinner label="Working out the restock run…" />;
  if (run.isError) return <QueryErrorNotice error={run.error} onRetry={() => void run.refetch()} />;
  return (
    <div className="space-y-4">
      {applied ? <Alert tone="success">{applied}</Alert> : null}
      {apply.error ? (
        <Alert tone="error" title="Nothing was moved.">
          {apply.error.message}
        </Alert>
      ) : null}
      {run.data.lines.length === 0 ? (
        <Alert tone="success">Every van holds what it needs. Nothing to pick.</Alert>
      ) : (
        // A fresh review each time the run is recomputed (after applying, or stock moving).
        <Review key={run.dataUpdatedAt} run={run.data} canApply={canApply} apply={apply} setApplied={setApplied} />
      )}
    </div>
  );
}
