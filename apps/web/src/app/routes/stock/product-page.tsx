import { useQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { formatPackSize, productKindLabel } from '@heatfleet/domain';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { paths } from '@/config/paths';
import { useAbility } from '@/lib/ability';
import { useSignedInMe } from '@/lib/auth';
import { productQueries } from '@/features/stock/api/stock-queries';
import { ParLevelsEditor } from '@/features/stock/components/par-levels-editor';
import { doseText, targetRangeText } from '@/features/stock/components/product-columns';
import { ProductForm } from '@/features/stock/components/product-form';
import { SafetyDataSheetCard } from '@/features/stock/components/safety-data-sheet-card';
import { StockNav } from '@/features/stock/components/stock-nav';

export function ProductPage() {
  const id = Number(useParams().id);
  const me = useSignedInMe();
  const ability = useAbility();
  const product = useQuery({ ...productQueries.detail(id), enabled: Number.isInteger(id) && id > 0 });
  if (product.isPending) return <PageSpinner label="Loading product…" />;
  if (product.isError) return <QueryErrorNotice error={product.error} onRetry={() => void product.refetch()} />;
  const p = product.data;
  const canEdit = ability.can('update', 'Product');
  return (
    <>
      <PageHeader title={p.name}>
        {productKindLabel(p)}, {formatPackSize(p.packSizeMl)} packs.{' '}
        <Link to={paths.products.getHref()} className="font-semibold text-brand-700 underline underline-offset-4">
          All products
        </Link>
      </PageHeader>
      <StockNav />
      <div className="space-y-5">
        <Card title="Safety data sheet">
          <SafetyDataSheetCard product={p} canUpload={canEdit} timeZone={me.activeFirm.timeZone} />
        </Card>
        {ability.can('update', 'ParLevel') ? (
          <Card
            title="Par levels"
            description="Packs to keep at each place: below the minimum it needs restocking, and a restock fills it to the target."
          >
            <ParLevelsEditor productId={p.id} />
          </Card>
        ) : null}
        {canEdit ? (
          <Card title="Details">
            <ProductForm key={p.id} product={p} />
          </Card>
        ) : (
          <Card title="Details">
            <dl className="grid gap-x-4 gap-y-2 sm:grid-cols-[max-content_1fr]">
              <dt className="font-semibold">Dose</dt>
              <dd>{doseText(p) || 'Not set'}</dd>
              <dt className="font-semibold">Target</dt>
              <dd>{targetRangeText(p) || 'Not set'}</dd>
              <dt className="font-semibold">Tested by</dt>
              <dd>{p.testMethod ?? 'Not set'}</dd>
              <dt className="font-semibold">Shelf life</dt>
              <dd>{p.shelfLifeMonths === null ? 'Not set' : `${p.shelfLifeMonths} months`}</dd>
              <dt className="font-semibold">Hazards</dt>
              <dd className="whitespace-pre-line">{p.hazardNotes ?? 'None noted'}</dd>
            </dl>
          </Card>
        )}
      </div>
    </>
  );
}
