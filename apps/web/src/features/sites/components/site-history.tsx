import { Link } from 'react-router-dom';
import type { SiteDetail } from '@heatfleet/domain';
import { Badge } from '@/components/ui/badge';
import { paths } from '@/config/paths';
import { formatCalendarDate, formatDate } from '@/lib/format';

export function SiteJobs({ jobs, timeZone }: { jobs: SiteDetail['jobs']; timeZone: string }) {
  if (jobs.length === 0) return <p className="text-ink-muted">No jobs at this site yet.</p>;
  return (
    <ul className="divide-y divide-line">
      {jobs.map((j) => (
        <li key={j.id}>
          <Link
            to={paths.job.getHref(j.id)}
            className="flex min-h-12 flex-wrap items-center justify-between gap-2 py-3 hover:bg-brand-50"
          >
            <span>
              <span className="font-semibold text-brand-700 underline underline-offset-4">
                {formatCalendarDate(j.scheduledOn)}
              </span>
              <span className="block text-sm text-ink-muted">
                {j.engineerName ?? 'No engineer'}
                {j.completedAt ? ` · completed ${formatDate(j.completedAt, timeZone)}` : ''}
              </span>
            </span>
            {j.status === 'completed' ? (
              <Badge tone="ok">Completed</Badge>
            ) : j.status === 'cancelled' ? (
              <Badge tone="danger">Cancelled</Badge>
            ) : (
              <Badge tone="neutral">Booked</Badge>
            )}
          </Link>
        </li>
      ))}
    </ul>
  );
}

export function SiteChecks({ checks }: { checks: SiteDetail['checks'] }) {
  if (checks.length === 0) return <p className="text-ink-muted">No inhibitor check visits recorded yet.</p>;
  return (
    <ul className="divide-y divide-line">
      {checks.map((c) => (
        <li key={c.id} className="space-y-1 py-3 first:pt-0">
          <div className="flex flex-wrap items-center justify-between gap-2">
            <span className="font-semibold">{formatCalendarDate(c.checkedOn)}</span>
            {c.result === 'pass' ? <Badge tone="ok">Pass</Badge> : <Badge tone="danger">Fail</Badge>}
          </div>
          <p className="text-sm">
            {c.product.name}: {c.inhibitorReading}
            {c.target.unit ? ` ${c.target.unit}` : ''} (target {c.target.min} to {c.target.max})
            {c.systemTdsPpm !== null ? `; system TDS ${c.systemTdsPpm} ppm` : ''}
          </p>
          {c.topUp || c.retestReading !== null ? (
            <p className="text-sm">
              {c.topUp
                ? `Topped up ${c.topUp.packs} pack${c.topUp.packs === 1 ? '' : 's'} from ${c.topUp.van.name}`
                : 'Tested again'}
              {c.retestReading !== null
                ? `; re-test ${c.retestReading}${c.target.unit ? ` ${c.target.unit}` : ''}`
                : ''}
              {c.firstResult !== c.result ? ` (first reading: ${c.firstResult})` : ''}
            </p>
          ) : null}
          {c.nextCheckOn ? <p className="text-sm">Next check set for {formatCalendarDate(c.nextCheckOn)}</p> : null}
          {c.notes ? <p className="text-sm text-ink-muted">{c.notes}</p> : null}
          <p className="text-sm text-ink-muted">
            By {c.byName}
            {c.noteEmailed ? ' · result e-mailed to the customer' : ''}
          </p>
        </li>
      ))}
    </ul>
  );
}
