import { useQuery } from '@tanstack/react-query';
import { formatPence } from '@heatfleet/domain';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { formatMonth } from '@/lib/format';
import { moneyQueries } from '../api/money-queries';

/** The owner's money at a glance: owed, aged by invoice date, overdue invoices, and revenue per month (net of VAT). */
export function MoneyOverviewSection() {
  const q = useQuery(moneyQueries.overview());
  if (q.isPending) return <p>Loading money…</p>;
  if (q.isError) return <QueryErrorNotice error={q.error} onRetry={() => void q.refetch()} />;
  const m = q.data;
  return (
    <section aria-labelledby="money-heading" className="space-y-3">
      <h2 id="money-heading" className="text-lg font-semibold">
        Money owed
      </h2>
      <dl className="grid grid-cols-2 gap-2 sm:grid-cols-4">
        <div>
          <dt className="text-sm">Owed</dt>
          <dd className="text-xl font-semibold">{formatPence(m.owedPence)}</dd>
        </div>
        <div>
          <dt className="text-sm">0 to 30 days</dt>
          <dd>{formatPence(m.aged.days_0_30)}</dd>
        </div>
        <div>
          <dt className="text-sm">31 to 60 days</dt>
          <dd>{formatPence(m.aged.days_31_60)}</dd>
        </div>
        <div>
          <dt className="text-sm">Over 60 days</dt>
          <dd>{formatPence(m.aged.days_over_60)}</dd>
        </div>
      </dl>
      <p>
        {m.overdueCount} invoice{m.overdueCount === 1 ? '' : 's'} past {m.overdueCount === 1 ? 'its' : 'their'} due
        date.
      </p>
      <h3 className="font-semibold">Revenue per month (excluding VAT, less credit notes)</h3>
      <table className="text-sm">
        <tbody>
          {m.revenueByMonth.map((r) => (
            <tr key={r.month}>
              <th scope="row" className="pr-4 text-left font-normal">
                {formatMonth(r.month)}
              </th>
              <td className="text-right">{formatPence(r.netPence)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}
