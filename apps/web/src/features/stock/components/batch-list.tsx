import { useQuery } from '@tanstack/react-query';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { formatCalendarDate } from '@/lib/format';
import { stockQueries } from '@/features/stock/api/stock-queries';
import { packsText } from '@/features/stock/components/stock-health';

/** The batches held at one place, soonest expiry first: the order they should be used in. */
export function BatchList({ locationId, productId, today }: { locationId: number; productId?: number; today: string }) {
  const batches = useQuery(stockQueries.batches(productId === undefined ? { locationId } : { locationId, productId }));
  if (batches.isPending) return <PageSpinner label="Loading batches…" />;
  if (batches.isError) return <QueryErrorNotice error={batches.error} onRetry={() => void batches.refetch()} />;
  if (batches.data.length === 0) return <p className="mt-2 text-ink-muted">Nothing held here.</p>;
  return (
    <ul className="mt-2 divide-y divide-line" aria-label="Batches held">
      {batches.data.map((row) => (
        <li key={row.batch.id} className="flex flex-wrap items-center justify-between gap-x-4 gap-y-1 py-2">
          <span>
            {productId === undefined ? <span className="block font-semibold">{row.product.name}</span> : null}
            <span className="font-mono">Lot {row.batch.lotNumber}</span>{' '}
            <span
              className={
                row.expired
                  ? 'font-semibold text-danger-700'
                  : row.batch.expiresOn <= today
                    ? 'text-ember-700'
                    : 'text-ink-muted'
              }
            >
              {row.expired ? 'expired' : 'use by'} {formatCalendarDate(row.batch.expiresOn)}
            </span>
          </span>
          <span className="font-semibold">{packsText(row.quantity)}</span>
        </li>
      ))}
    </ul>
  );
}
