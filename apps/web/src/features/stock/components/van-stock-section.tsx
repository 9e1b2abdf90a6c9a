import { useQuery } from '@tanstack/react-query';
import { stockHealthRank } from '@heatfleet/domain';
import { Link } from 'react-router-dom';
import { Alert } from '@/components/ui/alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { paths } from '@/config/paths';
import { formatCalendarDate } from '@/lib/format';
import { stockQueries } from '@/features/stock/api/stock-queries';
import { HealthBadge, packsOf, packsText } from '@/features/stock/components/stock-health';

/** The engineer's chemicals on board, what is low against the van's par levels first. */
export function VanStockSection() {
  const mine = useQuery(stockQueries.mine());
  if (mine.isPending) return <PageSpinner label="Loading van stock…" />;
  if (mine.isError) return <QueryErrorNotice error={mine.error} onRetry={() => void mine.refetch()} />;
  const { van, stock, batches } = mine.data;
  if (!van) return null;
  const rows = [...stock].sort(
    (a, b) => stockHealthRank[a.health] - stockHealthRank[b.health] || a.productName.localeCompare(b.productName),
  );
  const low = rows.filter((r) => r.health === 'empty' || r.health === 'below_minimum' || r.health === 'short_for_jobs');
  const expired = batches.filter((b) => b.expired);
  return (
    <div className="space-y-4">
      {low.length > 0 ? (
        <Alert tone="error" title={`${low.length} product${low.length === 1 ? '' : 's'} below what the van must hold`}>
          {low.map((r) => r.productName).join(', ')}. Ask the stores for a restock.
        </Alert>
      ) : rows.length > 0 ? (
        <Alert tone="success">Nothing on board is below its minimum.</Alert>
      ) : null}
      {expired.length > 0 ? (
        <Alert tone="error" title="Expired stock on board">
          Do not use:{' '}
          {expired.map((b) => `${b.product.name} lot ${b.batch.lotNumber} (${packsText(b.quantity)})`).join(', ')}. Hand
          it back to be written off.
        </Alert>
      ) : null}
      {rows.length === 0 ? (
        <p className="text-ink-muted">No chemical stock is recorded on this van.</p>
      ) : (
        <ul className="divide-y divide-line" aria-label="Stock on my van">
          {rows.map((row) => (
            <li key={row.productId} className="flex flex-wrap items-center justify-between gap-x-4 gap-y-1 py-3">
              <div className="min-w-0">
                <p className="font-semibold">{row.productName}</p>
                <p className="text-sm text-ink-muted">
                  {row.need
                    ? `Minimum ${row.need.minimum}, target ${row.need.target}${row.booked > 0 ? ` (booked jobs need ${row.booked})` : ''}`
                    : 'No level set'}
                  {batches
                    .filter((b) => b.product.id === row.productId && !b.expired)
                    .map((b) => ` · lot ${b.batch.lotNumber} use by ${formatCalendarDate(b.batch.expiresOn)}`)
                    .join('')}
                </p>
              </div>
              <div className="flex items-center gap-3">
                <span className="text-lg font-bold">{packsOf(row.usable, row.packSizeMl)}</span>
                <HealthBadge health={row.health} />
              </div>
            </li>
          ))}
        </ul>
      )}
      <Link
        to={paths.stockUse.getHref()}
        className="inline-flex min-h-12 items-center font-semibold text-brand-700 underline underline-offset-4"
      >
        Record stock used off the van
      </Link>
    </div>
  );
}
