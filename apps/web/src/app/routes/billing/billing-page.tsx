import { useSearchParams } from 'react-router-dom';
import { PageHeader } from '@/components/ui/page-header';
import { useSignedInMe } from '@/lib/auth';
import { BillingOverview } from '@/features/billing/components/billing-overview';

export function BillingPage() {
  const me = useSignedInMe();
  const [search] = useSearchParams();
  return (
    <>
      <PageHeader title="Billing">Heatfleet for {me.activeFirm.name}: charged monthly for each active van.</PageHeader>
      <BillingOverview timeZone={me.activeFirm.timeZone} cardSaved={search.get('card') === 'saved'} />
    </>
  );
}
