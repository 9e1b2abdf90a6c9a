import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { useAbility } from '@/lib/ability';
import { RestockRunPlan } from '@/features/stock/components/restock-run-plan';
import { StockNav } from '@/features/stock/components/stock-nav';

export function RestockRunPage() {
  const ability = useAbility();
  return (
    <>
      <PageHeader title="Restock run">
        What each van needs to reach its target, taken from the depot first expiry first.
      </PageHeader>
      <StockNav />
      <Card title="Pick list">
        <RestockRunPlan canApply={ability.can('create', 'Stock')} />
      </Card>
    </>
  );
}
