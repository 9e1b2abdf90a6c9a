import { useQuery } from '@tanstack/react-query';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { Can, useAbility } from '@/lib/ability';
import { moneyQueries } from '@/features/money/api/money-queries';
import { PriceItemsList } from '@/features/money/components/price-items-list';
import { PriceSettingsForm } from '@/features/money/components/price-settings-form';
import { productQueries } from '@/features/stock/api/stock-queries';

// Settings, Prices (issue 15): the firm's VAT registration, terms and reminders, and its price list. Everyone may
// read the prices; Owner and Admin change them (the domain's ability, 'update' 'PriceList'; the API checks it too).

export function PricesPage() {
  const q = useQuery(moneyQueries.prices());
  // The products a chemical's price sells (the stock feature's list), only asked for by those who set prices.
  const canSet = useAbility().can('update', 'PriceList');
  const products = useQuery({ ...productQueries.list(), enabled: canSet });
  return (
    <>
      <PageHeader title="Prices">
        What a visit, a chemical and an extra cost before VAT, and how the firm charges VAT and chases what is owed.
      </PageHeader>
      {q.isPending ? (
        <PageSpinner label="Loading prices…" />
      ) : q.isError ? (
        <QueryErrorNotice error={q.error} onRetry={() => void q.refetch()} />
      ) : (
        <div className="space-y-5">
          <Can I="update" a="PriceList">
            <Card title="VAT, terms and reminders">
              <PriceSettingsForm settings={q.data.settings} />
            </Card>
          </Can>
          <Card title="Price list" description="Prices before VAT; quotes and invoices already made keep theirs.">
            <PriceItemsList items={q.data.items} products={products.data ?? []} />
          </Card>
        </div>
      )}
    </>
  );
}
