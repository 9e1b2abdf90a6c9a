import { useQuery } from '@tanstack/react-query';
import { firmReadOnlyMessage } from '@heatfleet/domain';
import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Can } from '@/lib/ability';
import { formatDate } from '@/lib/format';
import { billingQueries } from '../api/billing-queries';

/** Every member sees when the firm is (or is about to be) read-only for an unpaid subscription; owners get the way out. */
export function ReadOnlyBanner({ timeZone }: { timeZone: string }) {
  const status = useQuery(billingQueries.status());
  if (!status.data?.paymentFailed) return null;
  const { readOnly, readOnlyFrom } = status.data;
  return (
    <div role="status" className="border-b-4 border-danger-700 bg-danger-50 px-4 py-3 text-danger-700">
      <p className="mx-auto max-w-5xl font-semibold">
        {readOnly
          ? `${firmReadOnlyMessage} Everything can still be read and exported.`
          : `The firm's Heatfleet payment did not go through. Unless it is paid, the firm becomes read-only on ${readOnlyFrom ? formatDate(readOnlyFrom, timeZone) : 'a date soon'}.`}{' '}
        <Can I="read" a="Billing">
          <Link to={paths.billing.getHref()} className="underline">
            Pay now
          </Link>
        </Can>
      </p>
    </div>
  );
}
