import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { formatPacks } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { paths } from '@/config/paths';
import { formatCalendarDate } from '@/lib/format';
import { stockQueries } from '@/features/stock/api/stock-queries';

/**
 * A warning for the jobs list and the engineer's home: booked jobs of the next days whose van will
 * not hold their packs (jobs take from the van in date order). Nothing shows while all is well or
 * while it loads; a failed load shows nothing either (the job's own page still checks its van).
 */
export function BookedJobsWarning({ engineerMemberId }: { engineerMemberId?: number }) {
  const short = useQuery(stockQueries.bookedJobsShort(engineerMemberId));
  if (!short.data || short.data.jobs.length === 0) return null;
  const { jobs, days } = short.data;
  return (
    <Alert
      tone="error"
      title={`${jobs.length} booked job${jobs.length === 1 ? '' : 's'} in the next ${days} days: the van does not hold the packs`}
    >
      <ul className="mt-1 space-y-1" aria-label="Booked jobs short of stock">
        {jobs.map((job) => (
          <li key={job.jobId}>
            <Link
              to={paths.job.getHref(job.jobId)}
              className="inline-flex min-h-12 items-center font-semibold underline underline-offset-4 [overflow-wrap:anywhere]"
            >
              {formatCalendarDate(job.scheduledOn)}, {job.address} ({job.van.name})
            </Link>
            <span className="block text-sm">
              Short:{' '}
              {job.short
                .map(
                  (p) =>
                    `${formatPacks(p.shortBy, p.product.packSizeMl)} of ${p.product.name} (needs ${p.packs}, ${p.available} left for it on the van)`,
                )
                .join('; ')}
              . Restock the van before the job.
            </span>
          </li>
        ))}
      </ul>
    </Alert>
  );
}
