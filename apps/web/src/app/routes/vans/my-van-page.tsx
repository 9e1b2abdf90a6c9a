import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { Alert } from '@/components/ui/alert';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { paths } from '@/config/paths';
import { useSignedInMe } from '@/lib/auth';
import { KitItemsList } from '@/features/kits/components/kit-items-list';
import { KitsTable } from '@/features/kits/components/kits-table';
import { VanStockSection } from '@/features/stock/components/van-stock-section';
import { vanQueries } from '@/features/vans/api/van-queries';
import { VanSummary } from '@/features/vans/components/van-summary';

export function MyVanPage() {
  const me = useSignedInMe();
  const mine = useQuery(vanQueries.mine());
  if (mine.isPending) return <PageSpinner label="Loading your van…" />;
  if (mine.isError) return <QueryErrorNotice error={mine.error} onRetry={() => void mine.refetch()} />;

  const { van, kits, items } = mine.data;
  if (!van) {
    return (
      <>
        <PageHeader title="My van" />
        <Alert tone="info">
          No van is assigned to you in {me.activeFirm.name}. The stores or the office can assign one.
        </Alert>
      </>
    );
  }
  const due = items.filter((item) => item.inspection.state === 'overdue' || item.inspection.state === 'due_soon');
  const loose = items.filter((item) => item.kit === null);
  return (
    <>
      <PageHeader title={`My van: ${van.name}`}>{van.registration}</PageHeader>
      <div className="space-y-5">
        {due.length > 0 ? (
          <Alert tone="error" title={`${due.length} item${due.length === 1 ? '' : 's'} due for inspection`}>
            <ul className="list-disc pl-5">
              {due.map((item) => (
                <li key={item.id}>
                  <Link to={paths.kitItem.getHref(item.id)} className="font-semibold underline">
                    {item.assetTag}
                  </Link>{' '}
                  {item.kind.name}: {item.inspection.state === 'overdue' ? 'overdue' : 'due soon'}
                </li>
              ))}
            </ul>
          </Alert>
        ) : (
          <Alert tone="success">Nothing on board is due for inspection.</Alert>
        )}
        <Card title="The van">
          <VanSummary van={van} timeZone={me.activeFirm.timeZone} />
        </Card>
        <Card title="Chemical stock" description="Usable packs on board against the van’s minimum and target.">
          <VanStockSection />
        </Card>
        <Card title="Kits on board">
          <KitsTable kits={kits} caption="Kits on my van" />
        </Card>
        <Card title="Loose items" description="On board but not part of a kit.">
          <KitItemsList items={loose} caption="Loose items on my van" />
        </Card>
      </div>
    </>
  );
}
