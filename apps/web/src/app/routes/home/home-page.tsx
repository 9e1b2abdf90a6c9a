import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { calendarDateIn, roleLabels, roleSummaries } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { paths } from '@/config/paths';
import { Can } from '@/lib/ability';
import { useSignedInMe } from '@/lib/auth';
import { FirmList } from '@/features/firms/components/firm-list';
import { MyJobs } from '@/features/jobs/components/my-jobs';
import { MoneyOverviewSection } from '@/features/money/components/money-overview-section';
import { BookedJobsWarning } from '@/features/stock/components/booked-jobs-warning';
import { MyHavToday, OwnerOverview } from '@/features/overview/components/owner-overview';
import { vanQueries } from '@/features/vans/api/van-queries';
import { VanSummary } from '@/features/vans/components/van-summary';

function MyVanCard({ timeZone }: { timeZone: string }) {
  const mine = useQuery(vanQueries.mine());
  return (
    <Card title="Your van">
      {mine.isPending ? (
        <PageSpinner label="Loading your van…" />
      ) : mine.isError ? (
        <QueryErrorNotice error={mine.error} onRetry={() => void mine.refetch()} />
      ) : mine.data.van ? (
        <div className="space-y-4">
          <VanSummary van={mine.data.van} timeZone={timeZone} />
          <Link to={paths.myVan.getHref()} className={buttonClasses('secondary', 'min-h-12 w-full sm:w-auto')}>
            Kit and stock on {mine.data.van.name}
          </Link>
        </div>
      ) : (
        <Alert tone="info">No van is assigned to you. The stores or the office can assign one.</Alert>
      )}
    </Card>
  );
}

function AccountCards({ withFirms }: { withFirms: boolean }) {
  const me = useSignedInMe();
  return (
    <>
      <Card title={`Your role: ${roleLabels[me.role]}`}>
        <p>{roleSummaries[me.role]}</p>
      </Card>
      {withFirms ? (
        <Card
          title="Your firms"
          description={me.memberships.length > 1 ? 'Switch to work in another firm.' : undefined}
        >
          <FirmList me={me} />
        </Card>
      ) : null}
      <Card title="Your account">
        <Link to={paths.account.getHref()} className={buttonClasses('secondary', 'min-h-12 w-full sm:w-auto')}>
          Your account and password
        </Link>
      </Card>
    </>
  );
}

export function HomePage() {
  const me = useSignedInMe();
  if (me.role === 'owner' || me.role === 'admin') {
    return (
      <>
        <PageHeader title={me.activeFirm.name}>The firm at a glance. Each card links to its list.</PageHeader>
        <OwnerOverview />
        <Can I="update" a="Invoice">
          <div className="mt-5">
            <Card title="Money" description="Owed by customers, aged from the invoice date, and revenue per month.">
              <MoneyOverviewSection />
              <Link to={paths.money.getHref()} className={buttonClasses('secondary', 'mt-4 min-h-12 w-full sm:w-auto')}>
                Invoices and the bookkeeper's export
              </Link>
            </Card>
          </div>
        </Can>
        <div className="mt-5 grid gap-5 lg:grid-cols-3">
          <AccountCards withFirms />
        </div>
      </>
    );
  }
  return (
    <>
      <PageHeader title={me.activeFirm.name}>
        Signed in as {me.user.name} ({me.user.email}).
      </PageHeader>
      <div className="grid gap-5 lg:grid-cols-2">
        {me.role === 'engineer' ? (
          <>
            <Card title="Your jobs" description="Today's first, then the next ones.">
              {/* Stock's warning (features/stock): your booked jobs whose van does not hold their packs. */}
              <BookedJobsWarning engineerMemberId={me.memberId} />
              <MyJobs memberId={me.memberId} today={calendarDateIn(new Date(), me.activeFirm.timeZone)} />
            </Card>
            <MyVanCard timeZone={me.activeFirm.timeZone} />
            <Card
              title="Hand-arm vibration today"
              description="From your agitation time on today's jobs: 100 points is the exposure action value, 400 the limit value."
            >
              <MyHavToday />
            </Card>
          </>
        ) : null}
        {/* An engineer's home is the day's work; their firms are on the account page. */}
        <AccountCards withFirms={me.role !== 'engineer'} />
      </div>
    </>
  );
}
