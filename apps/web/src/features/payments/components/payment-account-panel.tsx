import { useMutation, useQuery } from '@tanstack/react-query';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { Can } from '@/lib/ability';
import { paymentQueries, startOnboarding } from '../api/payment-queries';

/**
 * The firm's own account with the card payment service: customers' money lands there, never with Heatfleet.
 * Connecting happens on the service's own pages; coming back here shows the status it reports.
 */
export function PaymentAccountPanel({ returned }: { returned: boolean }) {
  const account = useQuery(paymentQueries.account());
  const connect = useMutation({
    mutationFn: startOnboarding,
    onSuccess: ({ url }) => window.location.assign(url),
  });
  if (account.isPending) return <p>Checking the payment account…</p>;
  if (account.isError) return <QueryErrorNotice error={account.error} />;
  const { connected, chargesEnabled } = account.data;
  return (
    <div className="space-y-4">
      {chargesEnabled ? (
        <Alert tone="success" title="Card payments are on">
          Customers can pay invoices by card from the e-mailed link or the QR code on an engineer&rsquo;s phone.
        </Alert>
      ) : connected ? (
        <Alert tone="info" title="Set-up not finished">
          {returned
            ? 'The payment service has not finished checking the account yet. Finish its set-up to take cards.'
            : 'Finish the set-up on the payment service’s pages to take cards.'}
        </Alert>
      ) : (
        <Alert tone="info" title="Not connected">
          Connect the firm&rsquo;s own payment account to let customers pay invoices by card.
        </Alert>
      )}
      {chargesEnabled ? null : (
        <Can I="update" a="PaymentAccount">
          <Button busy={connect.isPending} onClick={() => connect.mutate()}>
            {connected ? 'Finish set-up' : 'Connect payment account'}
          </Button>
        </Can>
      )}
      {connect.isError ? <QueryErrorNotice error={connect.error} /> : null}
    </div>
  );
}
