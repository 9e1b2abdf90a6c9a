import { useMemo } from 'react';
import { useQuery } from '@tanstack/react-query';
import { DataTable } from '@/components/ui/data-table';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { jobQueries } from '@/features/jobs/api/job-queries';
import { buildJobColumns } from '@/features/jobs/components/job-columns';

const initialSorting = [{ id: 'scheduledOn', desc: false }];

export function JobsTable() {
  const jobs = useQuery(jobQueries.list());
  const columns = useMemo(() => buildJobColumns(), []);
  if (jobs.isPending) return <PageSpinner label="Loading jobs…" />;
  if (jobs.isError) return <QueryErrorNotice error={jobs.error} onRetry={() => void jobs.refetch()} />;
  return (
    <DataTable
      columns={columns}
      data={jobs.data}
      getRowId={(job) => String(job.id)}
      caption="Cleaning jobs of the firm"
      filterLabel="Find a customer or address"
      itemsLabel="jobs"
      emptyMessage="No jobs booked yet."
      initialSorting={initialSorting}
    />
  );
}
