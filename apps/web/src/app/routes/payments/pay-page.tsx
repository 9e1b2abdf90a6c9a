import { useParams, useSearchParams } from 'react-router-dom';
import { payLinkTokenParamsSchema } from '@heatfleet/domain';
import { PublicLayout } from '@/components/layouts/public-layout';
import { Alert } from '@/components/ui/alert';
import { PublicPay } from '@/features/payments/components/public-pay';

// A public page (no sign-in): the invoice e-mail's link and the engineer's QR code lead here.
export function PayPage() {
  const { token = '' } = useParams();
  const [search] = useSearchParams();
  const valid = payLinkTokenParamsSchema.safeParse({ token });
  return (
    <PublicLayout title="Pay an invoice">
      {valid.success ? (
        <PublicPay
          token={valid.data.token}
          from={search.get('from') === 'doorstep' ? 'doorstep' : 'email_link'}
          returned={search.get('paid') === '1'}
        />
      ) : (
        <Alert tone="error">{valid.error.issues[0]?.message ?? 'This pay link is not valid.'}</Alert>
      )}
    </PublicLayout>
  );
}
