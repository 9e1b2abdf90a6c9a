import { useQuery } from '@tanstack/react-query';
import { Card } from '@/components/ui/card';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { paths } from '@/config/paths';
import { overviewQueries } from '@/features/overview/api/overview-queries';
import { HavToday } from '@/features/overview/components/hav-today';
import { DeferredUsageChart } from '@/features/overview/components/deferred-usage-chart';
import {
  ExpiringBatchesSummary,
  JobsThisMonthSummary,
  KitDueSummary,
  LinkCard,
  RecentReminders,
  VanHealthList,
} from '@/features/overview/components/overview-cards';

export function OwnerOverview() {
  const overview = useQuery(overviewQueries.detail());
  // The overview fills more than a screen: holding that space while it loads keeps the cards below it
  // from jumping down when it arrives (layout shift).
  if (overview.isPending)
    return (
      <div className="min-h-screen">
        <PageSpinner label="Loading the overview…" />
      </div>
    );
  if (overview.isError) return <QueryErrorNotice error={overview.error} onRetry={() => void overview.refetch()} />;
  const o = overview.data;
  return (
    <div className="space-y-5">
      {/* First, so the vans' stock health is above the fold on a phone and a laptop. */}
      <LinkCard
        title={`Vans: stock health, MOT and service (${o.vansDue} due)`}
        to={paths.vans.getHref()}
        linkLabel="All vans"
      >
        <VanHealthList vans={o.vans} />
      </LinkCard>
      <div className="grid gap-5 md:grid-cols-2 xl:grid-cols-3">
        <LinkCard title="Kit due" to={paths.kits.getHref()} linkLabel="All kits">
          <KitDueSummary kit={o.kit} />
        </LinkCard>
        <LinkCard title="Expiring batches" to={paths.stock.getHref()} linkLabel="Stock">
          <ExpiringBatchesSummary expiring={o.expiringBatches} />
        </LinkCard>
        <LinkCard title="Jobs this month" to={paths.jobs.getHref()} linkLabel="All jobs">
          <JobsThisMonthSummary jobs={o.jobsThisMonth} />
        </LinkCard>
        {o.hav ? (
          <LinkCard title="Hand-arm vibration today" to={paths.jobs.getHref()} linkLabel="Jobs">
            <p className="mb-3 text-sm text-ink-muted">
              HSE points from agitation time: 100 is the exposure action value, 400 the limit value.
            </p>
            <HavToday engineers={o.hav.engineers} />
          </LinkCard>
        ) : null}
        {o.reminders ? (
          <LinkCard title="Recent reminders" to={paths.reminders.getHref()} linkLabel="All reminders">
            <RecentReminders reminders={o.reminders} timeZone={o.timeZone} />
          </LinkCard>
        ) : null}
      </div>
      <Card
        title="Chemical used per month"
        description="Litres taken off vans on jobs, by kind of product, over the last twelve months."
      >
        <DeferredUsageChart months={o.usageByMonth} />
      </Card>
    </div>
  );
}

/** An engineer's own vibration points today, from the same overview answer. */
export function MyHavToday() {
  const overview = useQuery(overviewQueries.detail());
  if (overview.isPending) return <PageSpinner label="Loading…" />;
  if (overview.isError) return <QueryErrorNotice error={overview.error} onRetry={() => void overview.refetch()} />;
  if (!overview.data.hav) return <p className="text-ink-muted">Vibration points are not recorded yet.</p>;
  return <HavToday engineers={overview.data.hav.engineers} showNames={false} />;
}
