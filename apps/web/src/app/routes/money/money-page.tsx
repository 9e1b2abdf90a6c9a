import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { calendarDateIn, formatPence, invoiceStateLabels } from '@heatfleet/domain';
import { PageHeader } from '@/components/ui/page-header';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { TextField } from '@/components/ui/text-field';
import { useSignedInMe } from '@/lib/auth';
import { paths } from '@/config/paths';
import { exportHref, invoicePdfHref, moneyQueries } from '@/features/money/api/money-queries';
import { MoneyOverviewSection } from '@/features/money/components/money-overview-section';

// The office's money page (Owner, Admin): money owed and revenue, the invoices with their PDFs, and the
// bookkeeper's CSV for a date range. Each invoice opens its own page; prices and VAT are set in Settings, Prices.

function Invoices() {
  const q = useQuery(moneyQueries.invoices());
  if (q.isPending) return <p>Loading invoices…</p>;
  if (q.isError) return <QueryErrorNotice error={q.error} onRetry={() => void q.refetch()} />;
  if (!q.data.length) return <p>No invoices yet. They are issued when a job is completed once prices are set.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm">
        <thead>
          <tr className="border-b">
            <th className="py-2 pr-2">Number</th>
            <th className="py-2 pr-2">Customer</th>
            <th className="py-2 pr-2">State</th>
            <th className="py-2 pr-2 text-right">Total</th>
            <th className="py-2 pr-2 text-right">Due</th>
            <th className="py-2">PDF</th>
          </tr>
        </thead>
        <tbody>
          {q.data.map((i) => (
            <tr key={i.id} className="border-b">
              <td className="py-2 pr-2">
                <Link
                  className="inline-flex min-h-12 items-center font-semibold underline"
                  to={paths.invoice.getHref(i.id)}
                >
                  {i.number ?? 'Draft'}
                </Link>
              </td>
              <td className="py-2 pr-2">{i.customerName}</td>
              <td className="py-2 pr-2">{invoiceStateLabels[i.status]}</td>
              <td className="py-2 pr-2 text-right">{formatPence(i.totalPence)}</td>
              <td className="py-2 pr-2 text-right">{formatPence(i.duePence)}</td>
              <td className="py-2">
                <a className="inline-flex min-h-12 items-center underline" href={invoicePdfHref(i.id)}>
                  Download
                </a>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export function MoneyPage() {
  const me = useSignedInMe();
  const today = calendarDateIn(new Date(), me.activeFirm.timeZone);
  const [from, setFrom] = useState(`${today.slice(0, 7)}-01`);
  const [to, setTo] = useState(today);
  return (
    <div className="space-y-6">
      <PageHeader title="Money">
        <Link className="inline-flex min-h-12 items-center underline" to={paths.prices.getHref()}>
          Prices and VAT
        </Link>
      </PageHeader>
      <MoneyOverviewSection />
      <section className="space-y-3">
        <h2 className="text-lg font-semibold">Invoices</h2>
        <Invoices />
      </section>
      <section className="space-y-3">
        <h2 className="text-lg font-semibold">Export for the bookkeeper</h2>
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField label="From" name="from" type="date" value={from} onChange={(e) => setFrom(e.target.value)} />
          <TextField label="To" name="to" type="date" value={to} onChange={(e) => setTo(e.target.value)} />
        </div>
        <a className="inline-flex min-h-12 items-center underline" href={exportHref(from, to)}>
          Download invoices, credit notes and payments (CSV)
        </a>
      </section>
    </div>
  );
}
