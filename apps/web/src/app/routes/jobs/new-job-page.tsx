import { calendarDateIn } from '@heatfleet/domain';
import { PageHeader } from '@/components/ui/page-header';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { useSignedInMe } from '@/lib/auth';
import { NewJobForm } from '@/features/jobs/components/new-job-form';
import { useBookingChoices } from '@/app/routes/jobs/use-booking-choices';

export function NewJobPage() {
  const me = useSignedInMe();
  const choices = useBookingChoices();
  const { products } = choices;
  if (products.isPending || choices.firmPending) return <PageSpinner label="Loading products…" />;
  if (products.isError) return <QueryErrorNotice error={products.error} onRetry={() => void products.refetch()} />;
  return (
    <>
      <PageHeader title="Book a job">The survey, with the system volume and doses worked out as you type.</PageHeader>
      <NewJobForm
        products={choices.doseProducts}
        engineers={choices.engineers}
        defaultEngineerId={me.role === 'engineer' ? me.memberId : null}
        today={calendarDateIn(new Date(), me.activeFirm.timeZone)}
        heatExchangerDefaults={choices.heatExchangerDefaults}
        ownDefaults={choices.ownDefaults}
        vanStock={choices.vanStock}
      />
    </>
  );
}
