import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { useSignedInMe } from '@/lib/auth';
import { LedgerView } from '@/features/stock/components/ledger-view';
import { StockNav } from '@/features/stock/components/stock-nav';

export function LedgerPage() {
  const me = useSignedInMe();
  return (
    <>
      <PageHeader title="Stock ledger">
        Every movement of stock, newest first. Nothing is edited or deleted: a mistake is put right by a reversal.
      </PageHeader>
      <StockNav />
      <Card title="Movements">
        <LedgerView timeZone={me.activeFirm.timeZone} />
      </Card>
    </>
  );
}
