import { useQuery } from '@tanstack/react-query';
import { formatPence, invoiceStateLabels, paymentStatusLabels } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { Can } from '@/lib/ability';
import { formatDateTime } from '@/lib/format';
import { paymentQueries } from '../api/payment-queries';
import { RefundForm } from './refund-form';
import { TakePayment } from './take-payment';

/**
 * An invoice's money: what is owed, the pay QR for the doorstep, the card payments with their refunds. While a
 * QR code is on screen the payments are asked for every 3 seconds, so "Paid" shows moments after the customer pays.
 */
export function InvoicePayments({ invoiceId, timeZone }: { invoiceId: number; timeZone: string }) {
  const payments = useQuery({ ...paymentQueries.invoice(invoiceId), refetchInterval: 3_000 });
  if (payments.isPending) return <p>Loading the invoice&rsquo;s payments…</p>;
  if (payments.isError) return <QueryErrorNotice error={payments.error} onRetry={() => void payments.refetch()} />;
  const { invoice, cardPaymentsReady } = payments.data;
  return (
    <div className="space-y-5">
      <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4">
        <div>
          <dt className="text-sm text-ink-muted">Invoice</dt>
          <dd className="font-semibold">{invoice.number ?? 'Draft'}</dd>
        </div>
        <div>
          <dt className="text-sm text-ink-muted">State</dt>
          <dd className="font-semibold" data-testid="invoice-state">
            {invoiceStateLabels[invoice.status]}
          </dd>
        </div>
        <div>
          <dt className="text-sm text-ink-muted">Total</dt>
          <dd className="font-semibold">{formatPence(invoice.totalPence)}</dd>
        </div>
        <div>
          <dt className="text-sm text-ink-muted">Still owed</dt>
          <dd className="font-semibold" data-testid="invoice-due">
            {formatPence(invoice.duePence)}
          </dd>
        </div>
      </dl>
      {invoice.duePence > 0 && invoice.status !== 'draft' ? (
        cardPaymentsReady ? (
          <TakePayment invoiceId={invoiceId} duePence={invoice.duePence} />
        ) : (
          <Alert tone="info" title="Card payments are not set up">
            An owner connects the firm&rsquo;s payment account in Settings, Payments.
          </Alert>
        )
      ) : invoice.status === 'paid' ? (
        <Alert tone="success" title="Paid">
          Nothing is owed on this invoice.
        </Alert>
      ) : null}
      <section aria-labelledby="card-payments" className="space-y-3">
        <h2 id="card-payments" className="text-lg font-bold text-brand-900">
          Card payments
        </h2>
        {payments.data.payments.length === 0 ? <p className="text-ink-muted">None yet.</p> : null}
        <ul className="space-y-3">
          {payments.data.payments.map((p) => (
            <li key={p.id} className="rounded-md border border-line p-3">
              <p className="font-semibold">
                {formatPence(p.amountPence)}: {paymentStatusLabels[p.status]}
                {p.refundedPence > 0 ? `, ${formatPence(p.refundedPence)} refunded` : ''}
              </p>
              <p className="text-sm text-ink-muted">
                {formatDateTime(p.paidAt ?? p.createdAt, timeZone)} ·{' '}
                {p.startedFrom === 'doorstep' ? 'QR code on the doorstep' : 'link in the e-mail'}
              </p>
              {p.failureMessage && p.status === 'failed' ? <p className="text-danger-700">{p.failureMessage}</p> : null}
              {p.refunds.map((r) => (
                <p key={r.id} className="text-sm">
                  Refund {formatPence(r.amountPence)} on {formatDateTime(r.createdAt, timeZone)}
                  {r.reason ? `: ${r.reason}` : ''}
                </p>
              ))}
              {p.status === 'succeeded' && p.refundedPence < p.amountPence ? (
                <Can I="update" a="Payment">
                  <details className="mt-2">
                    <summary className="min-h-12 cursor-pointer py-3 font-semibold text-brand-700">Refund…</summary>
                    <RefundForm invoiceId={invoiceId} paymentId={p.id} leftPence={p.amountPence - p.refundedPence} />
                  </details>
                </Can>
              ) : null}
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
