import type { ReactNode } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Alert } from '@/components/ui/alert';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { useAbility } from '@/lib/ability';
import { stockQueries } from '@/features/stock/api/stock-queries';
import { useStockChoices } from '@/features/stock/api/use-stock-choices';
import { ReceiveForm } from '@/features/stock/components/receive-form';
import { StockNav } from '@/features/stock/components/stock-nav';
import { StocktakeForm } from '@/features/stock/components/stocktake-form';
import { TransferForm } from '@/features/stock/components/transfer-form';
import { UseForm } from '@/features/stock/components/use-form';
import { WriteOffForm } from '@/features/stock/components/write-off-form';

type Choices = ReturnType<typeof useStockChoices>;

/** The frame every stock form shares: header, stock links, loading the places and products, and the permission check. */
function StockFormPage({
  title,
  intro,
  allowed,
  children,
}: {
  title: string;
  intro: string;
  allowed: boolean;
  children: (choices: Choices) => ReactNode;
}) {
  const choices = useStockChoices();
  let body: ReactNode;
  if (!allowed) body = <Alert tone="info">Only the stores, an admin or the owner can do this.</Alert>;
  else if (choices.isPending) body = <PageSpinner />;
  else if (choices.error) body = <QueryErrorNotice error={choices.error} onRetry={() => void choices.retry()} />;
  else body = children(choices);
  return (
    <>
      <PageHeader title={title}>{intro}</PageHeader>
      <StockNav />
      <Card>{body}</Card>
    </>
  );
}

export function ReceivePage() {
  const ability = useAbility();
  return (
    <StockFormPage
      title="Receive a delivery"
      intro="Each line is one product and lot, with its use-by date from the pack."
      allowed={ability.can('create', 'Stock')}
    >
      {(choices) =>
        choices.depots.length === 0 ? (
          <Alert tone="info">Add a depot under Vans first.</Alert>
        ) : (
          <ReceiveForm depots={choices.depots} products={choices.products} />
        )
      }
    </StockFormPage>
  );
}

export function TransferPage() {
  const ability = useAbility();
  return (
    <StockFormPage
      title="Transfer stock"
      intro="Depot to van, van to van or van to depot. Each line is taken first expiry first."
      allowed={ability.can('create', 'Stock')}
    >
      {(choices) => <TransferForm places={choices.places} products={choices.products} />}
    </StockFormPage>
  );
}

export function UsePage() {
  const ability = useAbility();
  const canAnywhere = ability.can('create', 'Stock');
  // An engineer records use from their own van only, so that is the only place offered.
  const mine = useQuery({ ...stockQueries.mine(), enabled: !canAnywhere });
  return (
    <StockFormPage
      title="Record stock used"
      intro="For stock used outside a job, e.g. a top-up or a workshop test."
      allowed={ability.can('create', 'StockUse')}
    >
      {(choices) => {
        if (canAnywhere) return <UseForm places={choices.places} products={choices.products} />;
        if (mine.isPending) return <PageSpinner />;
        if (mine.isError) return <QueryErrorNotice error={mine.error} onRetry={() => void mine.refetch()} />;
        const van = mine.data.van;
        const place = van ? choices.vans.find((v) => v.id === van.id) : undefined;
        if (!place) return <Alert tone="info">No van is assigned to you, so there is no stock to use.</Alert>;
        return <UseForm places={[place]} products={choices.products} defaultPlaceId={place.id} />;
      }}
    </StockFormPage>
  );
}

export function StocktakePage() {
  const ability = useAbility();
  return (
    <StockFormPage
      title="Stocktake"
      intro="Count one place batch by batch; the differences are recorded as adjustments."
      allowed={ability.can('create', 'Stock')}
    >
      {(choices) => <StocktakeForm places={choices.places} />}
    </StockFormPage>
  );
}

export function WriteOffPage() {
  const ability = useAbility();
  return (
    <StockFormPage
      title="Write off stock"
      intro="Expired, damaged or spilled packs leave the stock here, with the reason kept in the ledger."
      allowed={ability.can('create', 'Stock')}
    >
      {(choices) => <WriteOffForm places={choices.places} />}
    </StockFormPage>
  );
}
