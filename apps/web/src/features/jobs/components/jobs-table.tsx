import { useMemo, useState } from 'react';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import type { JobListQuery } from '@heatfleet/domain';
import { DataTable } from '@/components/ui/data-table';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { jobQueries } from '@/features/jobs/api/job-queries';
import { buildJobColumns } from '@/features/jobs/components/job-columns';

export interface EngineerFilterChoice {
  memberId: number;
  name: string;
}

const statusOptions = [
  { value: '', label: 'Every status' },
  { value: 'planned', label: 'Booked' },
  { value: 'completed', label: 'Completed' },
  { value: 'cancelled', label: 'Cancelled' },
];

/**
 * The firm's jobs, the soonest booked visit first and then the rest newest first (the API's
 * "upcoming" order), narrowed by status, engineer and dates on the server.
 */
export function JobsTable({ engineers }: { engineers: EngineerFilterChoice[] }) {
  const [filters, setFilters] = useState<JobListQuery>({ sort: 'upcoming' });
  const jobs = useQuery({ ...jobQueries.list(filters), placeholderData: keepPreviousData });
  const columns = useMemo(() => buildJobColumns(), []);
  const set = (patch: Partial<JobListQuery>) => setFilters((f) => ({ ...f, ...patch }));
  if (jobs.isPending) return <PageSpinner label="Loading jobs…" />;
  if (jobs.isError) return <QueryErrorNotice error={jobs.error} onRetry={() => void jobs.refetch()} />;
  const toolbar = (
    <div role="group" aria-label="Filters" className="grid grid-cols-2 gap-3 lg:grid-cols-4">
      <SelectField
        label="Status"
        className="[&_select]:min-h-12"
        value={filters.status ?? ''}
        options={statusOptions}
        onChange={(e) => set({ status: (e.target.value || undefined) as JobListQuery['status'] })}
      />
      <SelectField
        label="Engineer"
        className="[&_select]:min-h-12"
        value={filters.engineerMemberId ? String(filters.engineerMemberId) : ''}
        options={[
          { value: '', label: 'Every engineer' },
          ...engineers.map((e) => ({ value: String(e.memberId), label: e.name })),
        ]}
        onChange={(e) => set({ engineerMemberId: e.target.value ? Number(e.target.value) : undefined })}
      />
      <TextField
        label="From"
        name="from"
        type="date"
        className="[&_input]:min-h-12"
        value={filters.from ?? ''}
        onChange={(e) => set({ from: e.target.value || undefined })}
      />
      <TextField
        label="To"
        name="to"
        type="date"
        className="[&_input]:min-h-12"
        value={filters.to ?? ''}
        onChange={(e) => set({ to: e.target.value || undefined })}
      />
    </div>
  );
  return (
    <DataTable
      columns={columns}
      data={jobs.data}
      getRowId={(job) => String(job.id)}
      caption="Cleaning jobs of the firm"
      filterLabel="Find a customer or address"
      itemsLabel="jobs"
      emptyMessage="No jobs match."
      toolbar={toolbar}
    />
  );
}
