import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { calendarDateIn } from '@heatfleet/domain';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { TextField } from '@/components/ui/text-field';
import { paths } from '@/config/paths';
import { useSignedInMe } from '@/lib/auth';
import { siteQueries } from '@/features/sites/api/site-queries';
import { CustomerSitesList } from '@/features/sites/components/customer-sites-list';

export function CustomersPage() {
  const me = useSignedInMe();
  const customers = useQuery(siteQueries.customers());
  const sites = useQuery(siteQueries.list());
  const [filter, setFilter] = useState('');
  return (
    <>
      <PageHeader title="Customers and sites">
        Each site keeps its jobs, its inhibitor checks and its next annual check.{' '}
        <Link to={paths.jobs.getHref()} className="font-semibold text-brand-700 underline underline-offset-4">
          Back to jobs
        </Link>
      </PageHeader>
      <Card>
        {customers.isPending || sites.isPending ? (
          <PageSpinner label="Loading customers…" />
        ) : customers.isError ? (
          <QueryErrorNotice error={customers.error} onRetry={() => void customers.refetch()} />
        ) : sites.isError ? (
          <QueryErrorNotice error={sites.error} onRetry={() => void sites.refetch()} />
        ) : (
          <div className="space-y-4">
            <TextField
              label="Find a customer or address"
              name="filter"
              type="search"
              value={filter}
              onChange={(e) => setFilter(e.target.value)}
              className="sm:max-w-md"
            />
            <CustomerSitesList
              customers={customers.data}
              sites={sites.data}
              today={calendarDateIn(new Date(), me.activeFirm.timeZone)}
              filter={filter}
            />
          </div>
        )}
      </Card>
    </>
  );
}
