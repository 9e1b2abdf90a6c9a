import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { visitKindLabels, type JobListRow } from '@heatfleet/domain';
import { Badge } from '@/components/ui/badge';
import { buttonClasses } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { paths } from '@/config/paths';
import { formatCalendarDate } from '@/lib/format';
import { jobQueries } from '@/features/jobs/api/job-queries';

const systemWords = { open_vented: 'open-vented', sealed: 'sealed' } as const;

/** The packs the plan needs and whether the job's van holds them now (the job's own plan). */
function PacksLine({ jobId }: { jobId: number }) {
  const detail = useQuery(jobQueries.detail(jobId));
  if (!detail.data) return <span className="text-sm text-ink-muted">Working out the packs…</span>;
  const { doses } = detail.data;
  if (doses.length === 0) return <span className="text-sm text-ink-muted">No products chosen.</span>;
  const short = doses.filter((d) => d.shortfall > 0);
  return (
    <span className="block space-y-1 text-sm">
      <span className="block">{doses.map((d) => `${d.packs} × ${d.product.name}`).join(', ')}</span>
      {short.length ? (
        <span className="inline-block rounded-md bg-danger-50 px-2 py-0.5 font-semibold text-danger-700">
          Van short: {short.map((d) => `${d.shortfall} × ${d.product.name}`).join(', ')}
        </span>
      ) : (
        <Badge tone="ok">The van holds them</Badge>
      )}
    </span>
  );
}

function JobRow({ job, today }: { job: JobListRow; today: string }) {
  return (
    <li>
      <Link
        to={paths.job.getHref(job.id)}
        className="block min-h-14 space-y-1 rounded-lg border-2 border-line-strong bg-card px-3 py-2"
      >
        <span className="block font-bold text-brand-900">
          {job.scheduledOn === today ? 'Today' : formatCalendarDate(job.scheduledOn)}
          {job.scheduledTime ? `, ${job.scheduledTime}` : ''}
        </span>
        <span className="block font-semibold break-words text-ink">{job.address}</span>
        <span className="block text-sm text-ink-muted">
          {job.customerName}
          {job.postcode ? `, ${job.postcode}` : ''} · {visitKindLabels[job.visitKind]}, {systemWords[job.systemType]},{' '}
          {job.radiatorCount} radiators
        </span>
        <PacksLine jobId={job.id} />
      </Link>
    </li>
  );
}

/** An engineer's next visits, today's first: where, what system, the packs and whether the van holds them. */
export function MyJobs({ memberId, today }: { memberId: number; today: string }) {
  const jobs = useQuery(
    jobQueries.list({ engineerMemberId: memberId, status: 'planned', from: today, sort: 'upcoming' }),
  );
  if (jobs.isPending) return <PageSpinner label="Loading your jobs…" />;
  if (jobs.isError) return <QueryErrorNotice error={jobs.error} onRetry={() => void jobs.refetch()} />;
  const next = jobs.data.slice(0, 4);
  return (
    <div className="space-y-3">
      {next.length === 0 ? (
        <p className="text-ink-muted">No booked jobs for you from today.</p>
      ) : (
        <ul aria-label="Your next jobs" className="space-y-2">
          {next.map((job) => (
            <JobRow key={job.id} job={job} today={today} />
          ))}
        </ul>
      )}
      <Link to={paths.jobs.getHref()} className={buttonClasses('secondary', 'min-h-12 w-full sm:w-auto')}>
        All jobs
      </Link>
    </div>
  );
}
