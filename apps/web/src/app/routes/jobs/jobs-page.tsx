import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';
import { Can, useAbility } from '@/lib/ability';
import { useSignedInMe } from '@/lib/auth';
import { JobsTable, type EngineerFilterChoice } from '@/features/jobs/components/jobs-table';
import { BookedJobsWarning } from '@/features/stock/components/booked-jobs-warning';
import { memberQueries } from '@/features/team/api/member-queries';

export function JobsPage() {
  const me = useSignedInMe();
  const ability = useAbility();
  const members = useQuery({ ...memberQueries.list(), enabled: ability.can('read', 'Member') });
  const engineers: EngineerFilterChoice[] = (members.data ?? [])
    .filter((m) => m.role === 'engineer' || m.id === me.memberId)
    .sort((a, b) => a.name.localeCompare(b.name))
    .map((m) => ({ memberId: m.id, name: m.id === me.memberId ? `${m.name} (me)` : m.name }));
  return (
    <>
      <PageHeader title="Jobs">Cleaning visits: the next booked first, then the rest, newest first.</PageHeader>
      <div className="space-y-5">
        <div className="flex flex-col gap-3 sm:flex-row">
          <Can I="create" a="Job">
            <Link to={paths.newJob.getHref()} className={buttonClasses('primary', 'min-h-12 w-full sm:w-auto')}>
              Book a job
            </Link>
          </Can>
          <Link to={paths.customers.getHref()} className={buttonClasses('secondary', 'min-h-12 w-full sm:w-auto')}>
            Customers and sites
          </Link>
        </div>
        {/* Stock's warning (features/stock): booked jobs whose van does not hold their packs. */}
        <BookedJobsWarning />
        <Card title="Jobs">
          <JobsTable
            engineers={engineers.length ? engineers : [{ memberId: me.memberId, name: `${me.user.name} (me)` }]}
          />
        </Card>
      </div>
    </>
  );
}
