import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import type { RestockRunLine } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { formatCalendarDate } from '@/lib/format';
import { useIdempotencyKey } from '@/lib/idempotency';
import { stockQueries } from '@/features/stock/api/stock-queries';
import { useApplyRestockRun } from '@/features/stock/api/use-stock-movement';
import { packsText } from '@/features/stock/components/stock-health';

function byVan(lines: RestockRunLine[]) {
  const vans = new Map<number, { van: RestockRunLine['van']; lines: RestockRunLine[] }>();
  for (const line of lines) {
    const entry = vans.get(line.van.id) ?? { van: line.van, lines: [] };
    entry.lines.push(line);
    vans.set(line.van.id, entry);
  }
  return [...vans.values()].sort((a, b) => a.van.name.localeCompare(b.van.name, 'en-GB', { numeric: true }));
}

/**
 * The restock run as a pick list: per van, what to take from which lot. Reviewed on screen, printed
 * for the shelf, and applied in one step (all the transfers, or none if stock moved meanwhile).
 */
export function RestockRunPlan({ canApply }: { canApply: boolean }) {
  const run = useQuery(stockQueries.restockRun());
  const apply = useApplyRestockRun();
  const idempotency = useIdempotencyKey();
  const [applied, setApplied] = useState<string | null>(null);

  if (run.isPending) return <PageSpinner label="Working out the restock run…" />;
  if (run.isError) return <QueryErrorNotice error={run.error} onRetry={() => void run.refetch()} />;
  const { depot, lines, today } = run.data;
  const vans = byVan(lines);
  const transfers = lines.flatMap((line) =>
    line.allocations.map((a) => ({
      toLocationId: line.van.id,
      productId: line.product.id,
      batchId: a.batchId,
      quantity: a.quantity,
    })),
  );
  const totalPacks = transfers.reduce((n, t) => n + t.quantity, 0);
  const shortLines = lines.filter((line) => line.shortfall > 0);

  return (
    <div className="space-y-4">
      <p className="hidden print:block">
        Pick list from {depot.name}, {formatCalendarDate(today)}
      </p>
      {applied ? <Alert tone="success">{applied}</Alert> : null}
      {apply.error ? (
        <Alert tone="error" title="Nothing was moved.">
          {apply.error.message}
        </Alert>
      ) : null}
      {lines.length === 0 ? (
        <Alert tone="success">Every van is at or above its target. Nothing to pick.</Alert>
      ) : (
        <>
          <p className="print:hidden">
            From <strong>{depot.name}</strong>: {packsText(totalPacks)} to {vans.length} van
            {vans.length === 1 ? '' : 's'}, first expiry first.
            {shortLines.length > 0
              ? ` ${shortLines.length} line${shortLines.length === 1 ? ' is' : 's are'} short: the depot does not hold enough.`
              : ''}
          </p>
          <div className="flex flex-col gap-2 sm:flex-row print:hidden">
            {canApply ? (
              <Button
                busy={apply.isPending}
                disabled={transfers.length === 0}
                className="min-h-14 text-lg sm:min-w-48"
                onClick={() => {
                  setApplied(null);
                  const body = { lines: transfers };
                  apply.mutate(
                    { ...body, idempotencyKey: idempotency.keyFor(body) },
                    {
                      onSuccess: () => {
                        idempotency.done();
                        setApplied(
                          `Applied: ${packsText(totalPacks)} moved from ${depot.name} to ${vans.length} van${vans.length === 1 ? '' : 's'}.`,
                        );
                      },
                    },
                  );
                }}
              >
                Apply restock run
              </Button>
            ) : null}
            <Button variant="secondary" className="min-h-14" onClick={() => window.print()}>
              Print pick list
            </Button>
          </div>
          <ol className="space-y-4 print:space-y-2" aria-label="Pick list by van">
            {vans.map(({ van, lines: vanLines }) => (
              <li
                key={van.id}
                className="rounded-xl border border-line bg-card p-4 print:break-inside-avoid print:rounded-none print:border-ink print:p-2"
              >
                <h3 className="text-lg font-bold text-brand-900 print:text-black">
                  {van.name}{' '}
                  {van.registration ? (
                    <span className="font-mono text-base font-normal">{van.registration}</span>
                  ) : null}
                </h3>
                <table className="mt-2 w-full border-collapse text-left text-sm">
                  <caption className="sr-only">What to pick for {van.name}</caption>
                  <thead>
                    <tr className="border-b border-line">
                      <th scope="col" className="py-1 pr-2">
                        Product
                      </th>
                      <th scope="col" className="py-1 pr-2">
                        Lot and use by
                      </th>
                      <th scope="col" className="py-1 pr-2 text-right">
                        Packs
                      </th>
                      <th scope="col" className="hidden w-10 py-1 print:table-cell">
                        ✓
                      </th>
                    </tr>
                  </thead>
                  <tbody>
                    {vanLines.map((line) => {
                      // One row per lot to pick, so each count sits beside its own lot; a shortfall gets a row of its own.
                      const picks = line.allocations.map((a) => ({ key: `lot-${a.batchId}`, allocation: a }));
                      const rows = [
                        ...picks,
                        ...(line.shortfall > 0 || picks.length === 0 ? [{ key: 'short', allocation: null }] : []),
                      ];
                      return rows.map((row, i) => (
                        <tr
                          key={`${line.product.id}-${row.key}`}
                          className={`align-top ${i === rows.length - 1 ? 'border-b border-line' : ''}`}
                        >
                          {i === 0 ? (
                            <th
                              scope="row"
                              rowSpan={rows.length}
                              className="py-1 pr-2 font-semibold [overflow-wrap:anywhere]"
                            >
                              {line.product.name}
                              <span className="block text-xs font-normal text-ink-muted">
                                has {line.usable}, target {line.par.target}
                              </span>
                            </th>
                          ) : null}
                          {row.allocation ? (
                            <>
                              <td className="py-1 pr-2">
                                <span className="font-mono">{row.allocation.lotNumber}</span>{' '}
                                <span className="text-xs whitespace-nowrap text-ink-muted">
                                  use by {formatCalendarDate(row.allocation.expiresOn)}
                                </span>
                              </td>
                              <td className="py-1 pr-2 text-right font-semibold">{row.allocation.quantity}</td>
                              <td className="hidden py-1 print:table-cell">
                                <span className="inline-block size-4 border border-black" />
                              </td>
                            </>
                          ) : (
                            <td colSpan={3} className="py-1 pr-2 font-semibold text-danger-700">
                              Short by {packsText(line.shortfall)}: the depot has no more usable stock of it.
                            </td>
                          )}
                        </tr>
                      ));
                    })}
                  </tbody>
                </table>
              </li>
            ))}
          </ol>
        </>
      )}
    </div>
  );
}
