import { useMutation, useQuery } from '@tanstack/react-query';
import { formatPence } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { isApiError } from '@/lib/api-client';
import { paymentQueries, startCheckout } from '../api/payment-queries';

/**
 * What the customer sees from the e-mailed link or the QR code: who is asking for how much, and one button to the
 * payment service's own card page (Heatfleet never sees the card). Back from paying, the page waits for the
 * service's confirmation.
 */
export function PublicPay({
  token,
  from,
  returned,
}: {
  token: string;
  from: 'email_link' | 'doorstep';
  returned: boolean;
}) {
  const link = useQuery({
    ...paymentQueries.payLink(token),
    refetchInterval: (q) => (returned && q.state.data?.state === 'payable' ? 2_000 : false),
  });
  const checkout = useMutation({
    mutationFn: () => startCheckout(token, from),
    onSuccess: ({ url }) => window.location.assign(url),
  });
  if (link.isPending) return <p>Loading…</p>;
  if (link.isError) {
    return (
      <Alert tone="error" title="This link does not work">
        {isApiError(link.error, 404)
          ? link.error.message
          : 'It could not be opened just now. Please try again shortly.'}
      </Alert>
    );
  }
  const pay = link.data;
  return (
    <div className="space-y-5">
      <div>
        <p className="text-ink-muted">{pay.firmName}</p>
        <h2 className="text-xl font-bold text-brand-900">Invoice {pay.invoiceNumber}</h2>
      </div>
      {pay.state === 'paid' ? (
        <Alert tone="success" title="Paid. Thank you.">
          {pay.firmName} has received your payment of {formatPence(pay.totalPence)}.
        </Alert>
      ) : pay.state === 'payable' ? (
        returned ? (
          <Alert tone="info" title="Confirming your payment…">
            This takes a few seconds. You can close this page; the firm will see your payment.
          </Alert>
        ) : (
          <>
            <p className="text-lg">
              To pay: <strong data-testid="due">{formatPence(pay.duePence)}</strong>
              {pay.duePence !== pay.totalPence ? ` (of ${formatPence(pay.totalPence)})` : ''}
            </p>
            <Button className="w-full min-h-12" busy={checkout.isPending} onClick={() => checkout.mutate()}>
              Pay {formatPence(pay.duePence)} by card
            </Button>
            <p className="text-sm text-ink-muted">
              You will pay on our card payment provider&rsquo;s secure page; your card details are never sent to{' '}
              {pay.firmName} or to Heatfleet.
            </p>
            {checkout.isError ? (
              <Alert tone="error" title="Card payment is not available just now">
                {checkout.error.message}
              </Alert>
            ) : null}
          </>
        )
      ) : (
        <Alert tone="info">Nothing can be paid on this invoice just now. Please contact {pay.firmName}.</Alert>
      )}
    </div>
  );
}
