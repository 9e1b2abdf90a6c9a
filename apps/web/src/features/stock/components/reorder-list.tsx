import { useQuery } from '@tanstack/react-query';
import { formatPackSize, formatPacks, penceToPounds } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { buttonClasses } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { reorderCsvHref, stockQueries } from '@/features/stock/api/stock-queries';

/** What the depot should order: products below minimum once the restock run has gone, back up to target. */
export function ReorderList() {
  const run = useQuery(stockQueries.restockRun());
  if (run.isPending) return <PageSpinner label="Working out the reorder list…" />;
  if (run.isError) return <QueryErrorNotice error={run.error} onRetry={() => void run.refetch()} />;
  const { reorder, depot, reorderTotalPence } = run.data;
  const pounds = (pence: number | null) => (pence === null ? 'No cost price' : `£${penceToPounds(pence)}`);
  return (
    <div className="space-y-4">
      <p className="text-ink-muted">
        For {depot.name}, after the vans have been restocked. Days of cover are worked out from the last 90 days of use
        across the firm.
      </p>
      <a href={reorderCsvHref} download className={buttonClasses('secondary')}>
        Download as CSV
      </a>
      {reorder.length === 0 ? (
        <Alert tone="success">Nothing to order: the depot stays at or above every minimum.</Alert>
      ) : (
        <table className="w-full border-collapse text-left max-sm:block">
          <caption className="sr-only">Reorder list</caption>
          <thead className="max-sm:hidden">
            <tr className="border-b-2 border-line text-sm text-ink-muted">
              <th scope="col" className="px-2 py-1">
                Product
              </th>
              <th scope="col" className="px-2 py-1 text-right">
                After restock
              </th>
              <th scope="col" className="px-2 py-1 text-right">
                Minimum / target
              </th>
              <th scope="col" className="px-2 py-1 text-right">
                Order
              </th>
              <th scope="col" className="px-2 py-1 text-right">
                Used in 90 days
              </th>
              <th scope="col" className="px-2 py-1 text-right">
                Days of cover
              </th>
              <th scope="col" className="px-2 py-1 text-right">
                Cost
              </th>
            </tr>
          </thead>
          <tbody className="max-sm:block max-sm:space-y-3">
            {reorder.map((row) => (
              <tr
                key={row.productId}
                className="border-b border-line max-sm:grid max-sm:grid-cols-2 max-sm:gap-1 max-sm:rounded-lg max-sm:border max-sm:bg-card max-sm:p-3"
              >
                <th scope="row" className="px-2 py-2 font-semibold max-sm:col-span-2 max-sm:px-0">
                  {row.product.name}
                  <span className="block text-sm font-normal text-ink-muted">
                    packs of {formatPackSize(row.product.packSizeMl)}
                    {row.product.supplierCode ? (
                      <>
                        {' '}
                        · supplier code <span className="font-mono">{row.product.supplierCode}</span>
                      </>
                    ) : null}
                  </span>
                </th>
                <td className="px-2 py-2 text-right max-sm:px-0 max-sm:text-left max-sm:before:block max-sm:before:text-sm max-sm:before:text-ink-muted max-sm:before:content-['After_restock']">
                  {row.usableAfterTransfers}
                </td>
                <td className="px-2 py-2 text-right max-sm:px-0 max-sm:text-left max-sm:before:block max-sm:before:text-sm max-sm:before:text-ink-muted max-sm:before:content-['Minimum_/_target']">
                  {row.par.minimum} / {row.par.target}
                </td>
                <td className="px-2 py-2 text-right text-lg font-bold text-brand-800 max-sm:px-0 max-sm:text-left max-sm:before:block max-sm:before:text-sm max-sm:before:font-normal max-sm:before:text-ink-muted max-sm:before:content-['Order_(packs)']">
                  {formatPacks(row.orderQuantity, row.product.packSizeMl)}
                </td>
                <td className="px-2 py-2 text-right max-sm:px-0 max-sm:text-left max-sm:before:block max-sm:before:text-sm max-sm:before:text-ink-muted max-sm:before:content-['Used_in_90_days']">
                  {row.used90Days}
                </td>
                <td className="px-2 py-2 text-right max-sm:px-0 max-sm:text-left max-sm:before:block max-sm:before:text-sm max-sm:before:text-ink-muted max-sm:before:content-['Days_of_cover']">
                  {row.daysOfCover ?? 'No recent use'}
                </td>
                <td className="px-2 py-2 text-right max-sm:px-0 max-sm:text-left max-sm:before:block max-sm:before:text-sm max-sm:before:text-ink-muted max-sm:before:content-['Cost']">
                  {pounds(row.lineCostPence)}
                  {row.product.costPricePence !== null ? (
                    <span className="block text-xs text-ink-muted">{pounds(row.product.costPricePence)} a pack</span>
                  ) : null}
                </td>
              </tr>
            ))}
          </tbody>
          <tfoot className="max-sm:block">
            <tr className="border-t-2 border-line max-sm:block">
              <th scope="row" colSpan={6} className="px-2 py-2 text-right max-sm:block max-sm:px-0 max-sm:text-left">
                Total{reorder.some((r) => r.lineCostPence === null) ? ' (lines with a cost price)' : ''}
              </th>
              <td className="px-2 py-2 text-right text-lg font-bold max-sm:block max-sm:px-0 max-sm:text-left">
                {pounds(reorderTotalPence)}
              </td>
            </tr>
          </tfoot>
        </table>
      )}
    </div>
  );
}
