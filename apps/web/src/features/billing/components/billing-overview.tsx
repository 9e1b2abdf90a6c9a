import { useMutation, useQuery } from '@tanstack/react-query';
import { formatPence } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { formatDate } from '@/lib/format';
import { billingQueries, startCardSetup, usePayNow } from '../api/billing-queries';

const statusWords: Record<string, string> = {
  trialing: 'Free trial',
  active: 'Active',
  past_due: 'Payment overdue',
  incomplete: 'Waiting for the first payment',
  canceled: 'Cancelled',
  unpaid: 'Unpaid',
};

/** The Owner's view of Heatfleet's own bill: per active van, monthly, with the card on file and past invoices. */
export function BillingOverview({ timeZone, cardSaved }: { timeZone: string; cardSaved: boolean }) {
  const billing = useQuery({ ...billingQueries.detail(), refetchInterval: cardSaved ? 3_000 : false });
  const card = useMutation({ mutationFn: startCardSetup, onSuccess: ({ url }) => window.location.assign(url) });
  const pay = usePayNow();
  if (billing.isPending) return <p>Loading billing…</p>;
  if (billing.isError) return <QueryErrorNotice error={billing.error} onRetry={() => void billing.refetch()} />;
  const { plan, status, invoices } = billing.data;
  const owing = invoices.some((i) => i.status === 'open');
  return (
    <div className="space-y-5">
      {status.readOnly ? (
        <Alert tone="error" title="The firm is read-only">
          Pay the overdue invoice to open it again at once. Nothing has been deleted.
        </Alert>
      ) : status.paymentFailed && status.readOnlyFrom ? (
        <Alert tone="error" title="The last payment did not go through">
          Unless it is paid, the firm becomes read-only on {formatDate(status.readOnlyFrom, timeZone)}.
        </Alert>
      ) : null}
      <Card title="Plan">
        <p className="text-lg font-semibold">
          {statusWords[plan.status] ?? plan.status}: {plan.vans} active {plan.vans === 1 ? 'van' : 'vans'} ×{' '}
          {formatPence(plan.unitPence)} = {formatPence(plan.monthlyPence)} a month
        </p>
        <p className="text-ink-muted">
          {plan.trialEndsAt && plan.status === 'trialing'
            ? `The free trial ends on ${formatDate(plan.trialEndsAt, timeZone)}.`
            : plan.periodEndsAt
              ? `The next bill is on ${formatDate(plan.periodEndsAt, timeZone)}.`
              : null}{' '}
          Adding or retiring a van changes the bill from that day, for the rest of the month.
        </p>
      </Card>
      <Card title="Card">
        <p className="mb-3">
          {billing.data.card
            ? `${billing.data.card.brand.toUpperCase()} ending ${billing.data.card.last4}, expires ${String(billing.data.card.expMonth).padStart(2, '0')}/${billing.data.card.expYear}`
            : 'No card saved yet.'}
        </p>
        <div className="flex flex-col gap-2 sm:flex-row">
          <Button busy={card.isPending} onClick={() => card.mutate()}>
            {billing.data.card ? 'Change card' : 'Add a card'}
          </Button>
          {owing && billing.data.card ? (
            <Button variant="secondary" busy={pay.isPending} onClick={() => pay.mutate()}>
              Pay the overdue invoice now
            </Button>
          ) : null}
        </div>
        {card.isError ? <Alert tone="error">{card.error.message}</Alert> : null}
        {pay.isError ? <Alert tone="error">{pay.error.message}</Alert> : null}
      </Card>
      <Card title="Invoices">
        {invoices.length === 0 ? <p className="text-ink-muted">No invoices yet.</p> : null}
        <ul className="divide-y divide-line">
          {invoices.map((i) => (
            <li key={i.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
              <span>
                {formatDate(i.createdAt, timeZone)} · {i.number ?? 'Invoice'} · {formatPence(i.amountDuePence)}
              </span>
              <span className="font-semibold">
                {i.status === 'paid' ? 'Paid' : i.status === 'open' ? 'Unpaid' : i.status}
              </span>
              {i.url ? (
                <a href={i.url} className="min-h-12 py-3 text-brand-700 underline">
                  View
                </a>
              ) : null}
            </li>
          ))}
        </ul>
      </Card>
    </div>
  );
}
