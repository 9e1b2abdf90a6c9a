import { Link } from 'react-router-dom';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';
import { Can } from '@/lib/ability';
import { JobsTable } from '@/features/jobs/components/jobs-table';

export function JobsPage() {
  return (
    <>
      <PageHeader title="Jobs">Cleaning visits: booked, done, and when each site is due its annual check.</PageHeader>
      <div className="space-y-5">
        <div className="flex flex-col gap-3 sm:flex-row">
          <Can I="create" a="Job">
            <Link to={paths.newJob.getHref()} className={buttonClasses('primary', 'w-full sm:w-auto')}>
              Book a job
            </Link>
          </Can>
          <Link to={paths.customers.getHref()} className={buttonClasses('secondary', 'w-full sm:w-auto')}>
            Customers and sites
          </Link>
        </div>
        <Card title="Jobs">
          <JobsTable />
        </Card>
      </div>
    </>
  );
}
