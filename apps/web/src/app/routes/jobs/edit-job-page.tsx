import { useQuery } from '@tanstack/react-query';
import { Navigate, useParams } from 'react-router-dom';
import { PageHeader } from '@/components/ui/page-header';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { paths } from '@/config/paths';
import { jobQueries } from '@/features/jobs/api/job-queries';
import { EditJobForm } from '@/features/jobs/components/edit-job-form';
import { useBookingChoices } from '@/app/routes/jobs/use-booking-choices';

export function EditJobPage() {
  const id = Number(useParams().id);
  const job = useQuery({ ...jobQueries.detail(id), enabled: Number.isInteger(id) && id > 0 });
  const choices = useBookingChoices();
  if (job.isPending || choices.products.isPending || choices.firmPending)
    return <PageSpinner label="Loading the job…" />;
  if (job.isError) return <QueryErrorNotice error={job.error} onRetry={() => void job.refetch()} />;
  // Only a booked job can change; a completed or cancelled one is its own record.
  if (job.data.job.status !== 'planned') return <Navigate to={paths.job.getHref(id)} replace />;
  return (
    <>
      <PageHeader title="Edit the job">
        Change the date, the engineer or the survey; the plan is worked out again when it is saved.
      </PageHeader>
      <EditJobForm
        detail={job.data}
        products={choices.doseProducts}
        engineers={choices.engineers}
        heatExchangerDefaults={choices.heatExchangerDefaults}
        ownDefaults={choices.ownDefaults}
        vanStock={choices.vanStock}
      />
    </>
  );
}
