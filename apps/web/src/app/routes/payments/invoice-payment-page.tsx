import { useParams } from 'react-router-dom';
import { PageHeader } from '@/components/ui/page-header';
import { useSignedInMe } from '@/lib/auth';
import { InvoicePayments } from '@/features/payments/components/invoice-payments';

export function InvoicePaymentPage() {
  const id = Number(useParams().id);
  const me = useSignedInMe();
  return (
    <>
      <PageHeader title="Take payment">
        The customer pays by card on their own phone; the invoice shows paid moments later.
      </PageHeader>
      <InvoicePayments invoiceId={id} timeZone={me.activeFirm.timeZone} />
    </>
  );
}
