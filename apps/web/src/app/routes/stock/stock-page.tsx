import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { useSignedInMe } from '@/lib/auth';
import { StockGridView } from '@/features/stock/components/stock-grid';
import { StockNav } from '@/features/stock/components/stock-nav';

export function StockPage() {
  const me = useSignedInMe();
  return (
    <>
      <PageHeader title="Stock">
        Usable packs of every product at every place in {me.activeFirm.name}, against each place’s minimum and target.
      </PageHeader>
      <StockNav />
      <Card title="Balances" description="Expired packs never count as usable; they wait to be written off.">
        <StockGridView />
      </Card>
    </>
  );
}
