import { useQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { daysBetween, calendarDateIn } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { paths } from '@/config/paths';
import { Can } from '@/lib/ability';
import { useSignedInMe } from '@/lib/auth';
import { formatCalendarDate } from '@/lib/format';
import { siteQueries } from '@/features/sites/api/site-queries';
import { SiteCheckForm } from '@/features/sites/components/site-check-form';
import { SiteChecks, SiteJobs } from '@/features/sites/components/site-history';

function NextCheckNotice({ on, today }: { on: string | null; today: string }) {
  if (!on)
    return (
      <Alert tone="info">
        No annual check date yet: it is set when a job here is completed or a check is recorded.
      </Alert>
    );
  const days = daysBetween(today, on);
  if (days < 0)
    return (
      <Alert tone="error" title="Annual check overdue">
        It was due on {formatCalendarDate(on)}.
      </Alert>
    );
  if (days <= 30)
    return (
      <Alert tone="info" title="Annual check due soon">
        Due on {formatCalendarDate(on)}, in {days} day{days === 1 ? '' : 's'}.
      </Alert>
    );
  return (
    <Alert tone="success" title={`Next annual check ${formatCalendarDate(on)}`}>
      A year on from the last clean or check.
    </Alert>
  );
}

export function SitePage() {
  const me = useSignedInMe();
  const id = Number(useParams().id);
  const site = useQuery({ ...siteQueries.detail(id), enabled: Number.isInteger(id) && id > 0 });
  if (site.isPending) return <PageSpinner label="Loading the site…" />;
  if (site.isError) return <QueryErrorNotice error={site.error} onRetry={() => void site.refetch()} />;
  const { site: s, customer, jobs, checks, nextCheckOn, inhibitors } = site.data;
  const today = calendarDateIn(new Date(), me.activeFirm.timeZone);
  return (
    <>
      <PageHeader title={s.address}>
        {customer.name}
        {s.postcode ? ` · ${s.postcode}` : ''} ·{' '}
        <Link to={paths.customers.getHref()} className="font-semibold text-brand-700 underline underline-offset-4">
          All customers
        </Link>
      </PageHeader>
      <div className="space-y-5">
        <NextCheckNotice on={nextCheckOn} today={today} />
        <div className="grid gap-5 lg:grid-cols-2">
          <Card title="Customer and site">
            <dl className="grid gap-3 sm:grid-cols-2">
              <div>
                <dt className="text-sm font-semibold text-ink-muted">Customer</dt>
                <dd>{customer.name}</dd>
              </div>
              <div>
                <dt className="text-sm font-semibold text-ink-muted">Contact</dt>
                <dd>
                  {[customer.contact, customer.phone, customer.email].filter(Boolean).join(' · ') || 'None given'}
                </dd>
              </div>
              <div>
                <dt className="text-sm font-semibold text-ink-muted">Access notes</dt>
                <dd>{s.accessNotes ?? 'None'}</dd>
              </div>
              <div>
                <dt className="text-sm font-semibold text-ink-muted">System notes</dt>
                <dd>{s.systemNotes ?? 'None'}</dd>
              </div>
            </dl>
          </Card>
          <Card title="Jobs" description="Newest first.">
            <SiteJobs jobs={jobs} timeZone={me.activeFirm.timeZone} />
          </Card>
        </div>
        <Can I="create" a="Customer">
          <Card
            title="Record an inhibitor check"
            description="Measure the inhibitor in the system water and compare it with the product's target range. A pass sets the next check a year on; a fail without a top-up and re-test, a month on."
          >
            <SiteCheckForm siteId={s.id} inhibitors={inhibitors} timeZone={me.activeFirm.timeZone} />
          </Card>
        </Can>
        <Card title="Inhibitor checks" description="Newest first.">
          <SiteChecks checks={checks} />
        </Card>
      </div>
    </>
  );
}
