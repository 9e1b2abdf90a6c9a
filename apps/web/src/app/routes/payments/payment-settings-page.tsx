import { useSearchParams } from 'react-router-dom';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { PaymentAccountPanel } from '@/features/payments/components/payment-account-panel';

// Also the page the payment service's onboarding returns to (?returned=1) or sends a used link back to (?expired=1).
export function PaymentSettingsPage() {
  const [search] = useSearchParams();
  return (
    <>
      <PageHeader title="Card payments">
        Customers pay invoices by card into the firm&rsquo;s own account with the payment service.
      </PageHeader>
      <Card title="Payment account">
        <PaymentAccountPanel returned={search.get('returned') === '1'} />
      </Card>
    </>
  );
}
