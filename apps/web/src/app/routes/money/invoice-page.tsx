import { useQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { PageHeader } from '@/components/ui/page-header';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { paths } from '@/config/paths';
import { useSignedInMe } from '@/lib/auth';
import { invoiceQuery } from '@/features/money/api/price-invoice-actions';
import { InvoiceDetail } from '@/features/money/components/invoice-detail';

export function InvoicePage() {
  const id = Number(useParams().id);
  const me = useSignedInMe();
  const q = useQuery(invoiceQuery(id));
  const title = q.data ? (q.data.number ? `Invoice ${q.data.number}` : 'Draft invoice') : 'Invoice';
  return (
    <>
      <PageHeader title={title}>
        <Link className="inline-flex min-h-12 items-center underline" to={paths.money.getHref()}>
          All invoices
        </Link>
      </PageHeader>
      {q.isPending ? (
        <PageSpinner label="Loading the invoice…" />
      ) : q.isError ? (
        <QueryErrorNotice error={q.error} onRetry={() => void q.refetch()} />
      ) : (
        <InvoiceDetail invoice={q.data} timeZone={me.activeFirm.timeZone} />
      )}
    </>
  );
}
