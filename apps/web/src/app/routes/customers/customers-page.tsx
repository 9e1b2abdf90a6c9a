import { useEffect, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Link, useSearchParams } from 'react-router-dom';
import { calendarDateIn, CUSTOMER_PAGE_SIZE } from '@heatfleet/domain';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { TextField } from '@/components/ui/text-field';
import { paths } from '@/config/paths';
import { useSignedInMe } from '@/lib/auth';
import { customerQueries } from '@/features/customers/api/customer-queries';
import { CustomerPageList } from '@/features/customers/components/customer-page-list';

function pageOf(value: string | null): number {
  const n = Number(value);
  return Number.isInteger(n) && n > 0 ? n : 1;
}

/** Customers, searched and paged by the server; the search and the page live in the URL so a link keeps them. */
export function CustomersPage() {
  const me = useSignedInMe();
  const [params, setParams] = useSearchParams();
  const q = params.get('q') ?? '';
  const page = pageOf(params.get('page'));
  const [text, setText] = useState(q);
  const customers = useQuery(customerQueries.page({ q: q || undefined, page, pageSize: CUSTOMER_PAGE_SIZE }));

  const go = (changes: { q?: string; page?: number }) =>
    setParams(
      (current) => {
        const next = new URLSearchParams(current);
        if ('q' in changes) {
          if (changes.q) next.set('q', changes.q);
          else next.delete('q');
          next.delete('page');
        }
        if (changes.page !== undefined) {
          if (changes.page > 1) next.set('page', String(changes.page));
          else next.delete('page');
        }
        return next;
      },
      { replace: true },
    );

  // Typing waits for a pause before asking the server, so each key press is not a request.
  useEffect(() => {
    if (text.trim() === q) return;
    const timer = setTimeout(() => go({ q: text.trim() }), 300);
    return () => clearTimeout(timer);
  });

  const data = customers.data;
  const pageCount = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;
  const first = data && data.total > 0 ? (data.page - 1) * data.pageSize + 1 : 0;
  const last = data ? first + data.customers.length - (data.customers.length > 0 ? 1 : 0) : 0;

  return (
    <>
      <PageHeader title="Customers and sites">
        Each site keeps its jobs, its inhibitor checks and its next annual check.{' '}
        <Link
          to={paths.jobs.getHref()}
          className="inline-flex min-h-12 items-center font-semibold text-brand-700 underline underline-offset-4"
        >
          Back to jobs
        </Link>
      </PageHeader>
      <Card>
        <div className="space-y-4">
          <TextField
            label="Find a customer or address"
            hint="A name, a street or a postcode"
            name="q"
            type="search"
            value={text}
            onChange={(e) => setText(e.target.value)}
            className="sm:max-w-md"
          />
          {customers.isPending ? (
            <PageSpinner label="Loading customers…" />
          ) : customers.isError ? (
            <QueryErrorNotice error={customers.error} onRetry={() => void customers.refetch()} />
          ) : data && data.total === 0 ? (
            <p className="text-ink-muted">
              {q ? `No customer or site matches "${q}".` : 'No customers yet. Add one when booking a job.'}
            </p>
          ) : data ? (
            <>
              <p
                className="text-sm text-ink-muted"
                aria-live="polite"
                aria-busy={customers.isPlaceholderData || undefined}
              >
                {customers.isPlaceholderData ? 'Loading… ' : null}
                {`Showing ${first}–${last} of ${data.total} customer${data.total === 1 ? '' : 's'}${q ? ` matching "${q}"` : ''}.`}
              </p>
              <CustomerPageList customers={data.customers} today={calendarDateIn(new Date(), me.activeFirm.timeZone)} />
              {pageCount > 1 ? (
                <nav aria-label="Pages of customers" className="flex items-center justify-between gap-2">
                  <Button
                    variant="secondary"
                    className="min-h-12"
                    onClick={() => go({ page: page - 1 })}
                    disabled={page <= 1}
                  >
                    Previous
                  </Button>
                  <span className="text-sm text-ink-muted">
                    Page {page} of {pageCount}
                  </span>
                  <Button
                    variant="secondary"
                    className="min-h-12"
                    onClick={() => go({ page: page + 1 })}
                    disabled={page >= pageCount}
                  >
                    Next
                  </Button>
                </nav>
              ) : null}
            </>
          ) : null}
        </div>
      </Card>
    </>
  );
}
