import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { ReorderList } from '@/features/stock/components/reorder-list';
import { StockNav } from '@/features/stock/components/stock-nav';

export function ReorderListPage() {
  return (
    <>
      <PageHeader title="Reorder list">Products the depot will be short of once the vans are restocked.</PageHeader>
      <StockNav />
      <Card title="To order">
        <ReorderList />
      </Card>
    </>
  );
}
