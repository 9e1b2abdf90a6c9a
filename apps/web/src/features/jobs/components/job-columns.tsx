import { Link } from 'react-router-dom';
import type { JobListRow } from '@heatfleet/domain';
import { createDataTableColumnHelper, type DataTableColumns } from '@/components/ui/data-table-columns';
import { paths } from '@/config/paths';
import { formatCalendarDate } from '@/lib/format';
import { JobStatusBadge } from '@/features/jobs/components/job-status-badge';

const helper = createDataTableColumnHelper<JobListRow>();

export function buildJobColumns(): DataTableColumns<JobListRow> {
  return helper.columns([
    // ISO calendar dates sort correctly as text.
    helper.accessor('scheduledOn', {
      header: 'Date',
      sortFn: 'text',
      enableGlobalFilter: false,
      cell: (info) => (
        <Link
          to={paths.job.getHref(info.row.original.id)}
          className="inline-flex min-h-12 items-center font-semibold whitespace-nowrap text-brand-700 underline underline-offset-4"
        >
          {formatCalendarDate(info.getValue())}
          {info.row.original.scheduledTime ? ` ${info.row.original.scheduledTime}` : ''}
        </Link>
      ),
    }),
    helper.accessor('customerName', { header: 'Customer', sortFn: 'text' }),
    helper.accessor('address', { header: 'Address', sortFn: 'text' }),
    helper.accessor((job) => job.engineerName ?? '', {
      id: 'engineer',
      header: 'Engineer',
      sortFn: 'text',
      cell: (info) => info.getValue() || <span className="text-ink-muted">Nobody yet</span>,
    }),
    helper.accessor('status', {
      header: 'Status',
      sortFn: 'text',
      cell: (info) => <JobStatusBadge status={info.getValue()} />,
    }),
    helper.accessor((job) => job.nextCheckOn ?? '9999-12-31', {
      id: 'nextCheck',
      header: 'Next check',
      sortFn: 'text',
      enableGlobalFilter: false,
      cell: (info) => {
        const on = info.row.original.nextCheckOn;
        return on ? formatCalendarDate(on) : <span className="text-ink-muted">After completion</span>;
      },
    }),
  ]);
}
